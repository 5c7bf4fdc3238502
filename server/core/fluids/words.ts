// Numbers as they appear in error messages and remarks: a few significant
// figures, a real minus sign, temperatures in degrees Celsius.

export function fmt(x: number, digits = 4): string {
  if (x === 0) return '0';
  const text = Math.abs(x) >= 1e6 || Math.abs(x) < 1e-3 ? x.toExponential(digits - 1).replace('e+', 'e') : String(Number(x.toPrecision(digits)));
  return text.replace(/-/g, '\u2212');
}

/** A temperature given in kelvin, written in °C for the reader. */
export function celsius(T: number): string {
  return `${fmt(T - 273.15)} \u00b0C`;
}

export function kelvinToCelsius(T: number): number {
  return T - 273.15;
}
