// Memo inputs are compared by identity: values are immutable and reused
// across runs, so "the same objects" means "nothing this depends on changed".
export function sameItems(a: readonly unknown[], b: readonly unknown[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}
