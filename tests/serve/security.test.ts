import { symlink } from 'node:fs/promises';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { checkSheetPath, HostPolicy, resolveSheetFile } from '../../server/serve/security.js';
import { makeFolder } from './helpers.js';

describe('HostPolicy on loopback', () => {
  const policy = new HostPolicy('127.0.0.1', 4180);
  it.each(['127.0.0.1:4180', 'localhost:4180', '[::1]:4180', 'LOCALHOST:4180'])('accepts %s', (host) => {
    expect(policy.allowsHost(host)).toBe(true);
  });
  it.each(['evil.test:4180', '127.0.0.1:4181', '127.0.0.1', '10.0.0.5:4180', '', 'localhost.evil.test:4180', '127.0.0.1:4180@evil'])(
    'refuses %s',
    (host) => {
      expect(policy.allowsHost(host)).toBe(false);
    },
  );
  it('refuses a missing Host header', () => {
    expect(policy.allowsHost(undefined)).toBe(false);
  });
  it('accepts pages of its own origin only', () => {
    expect(policy.allowsOrigin('http://127.0.0.1:4180', '127.0.0.1:4180')).toBe(true);
    expect(policy.allowsOrigin('http://evil.test:4180', '127.0.0.1:4180')).toBe(false);
    expect(policy.allowsOrigin('http://127.0.0.1:9999', '127.0.0.1:4180')).toBe(false);
    expect(policy.allowsOrigin('http://localhost:4180', '127.0.0.1:4180')).toBe(false);
    expect(policy.allowsOrigin('null', '127.0.0.1:4180')).toBe(false);
    expect(policy.allowsOrigin('file://', '127.0.0.1:4180')).toBe(false);
  });
});

describe('HostPolicy on a wildcard address', () => {
  const policy = new HostPolicy('0.0.0.0', 4180);
  it('accepts IP literals and loopback names but no other names', () => {
    expect(policy.allowsHost('192.168.1.20:4180')).toBe(true);
    expect(policy.allowsHost('localhost:4180')).toBe(true);
    expect(policy.allowsHost('rebind.evil.test:4180')).toBe(false);
  });
});

describe('checkSheetPath', () => {
  it.each(['wing.md', 'guide/language.md'])('accepts %s', (p) => {
    expect(checkSheetPath(p)).toBe(p);
  });
  it.each(['../etc/passwd.md', 'a/../../b.md', '/etc/x.md', 'a//b.md', './a.md', 'a\\..\\b.md', '.hidden.md', 'data.csv', 'a.md\0', ''])(
    'refuses %j',
    (p) => {
      expect(() => checkSheetPath(p)).toThrow();
    },
  );
});

describe('resolveSheetFile', () => {
  let cleanup: (() => Promise<void>)[] = [];
  afterEach(async () => {
    for (const c of cleanup) await c();
    cleanup = [];
  });

  it('resolves sheets inside, also through a symlink that stays inside', async () => {
    const folder = await makeFolder({ 'wing.md': 'w' });
    cleanup.push(folder.remove);
    await symlink(path.join(folder.dir, 'wing.md'), path.join(folder.dir, 'alias.md'));
    expect(await resolveSheetFile(folder.dir, 'alias.md')).toBe(path.join(folder.dir, 'wing.md'));
  });

  it('refuses a symlink that leads out of the folder', async () => {
    const outside = await makeFolder({ 'secret.md': 's' });
    const folder = await makeFolder({});
    cleanup.push(folder.remove, outside.remove);
    await symlink(path.join(outside.dir, 'secret.md'), path.join(folder.dir, 'leak.md'));
    await symlink(outside.dir, path.join(folder.dir, 'linked'));
    await expect(resolveSheetFile(folder.dir, 'leak.md')).rejects.toMatchObject({ code: 'outside-folder' });
    await expect(resolveSheetFile(folder.dir, 'linked/secret.md')).rejects.toMatchObject({ code: 'outside-folder' });
  });

  it('says when a sheet is missing', async () => {
    const folder = await makeFolder({});
    cleanup.push(folder.remove);
    await expect(resolveSheetFile(folder.dir, 'none.md')).rejects.toMatchObject({ code: 'missing' });
  });
});
