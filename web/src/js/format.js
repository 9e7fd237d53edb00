// Number and text formatting for display, and reading numbers the user types. No chemistry here: the
// engine computes every value; this module only writes them for people.

// KCAL is kilojoules per thermochemical kilocalorie (1 cal = 4.184 J exactly, by definition; common
// practice, no source needed beyond the definition).
export const KCAL = 4.184;

// MINUS is the typographic minus sign used in displayed numbers.
export const MINUS = "\u2212";

// energyIn converts kJ/mol to the display unit ("kJ" or "kcal").
export function energyIn(kj, unit) {
  return unit === "kcal" ? kj / KCAL : kj;
}

// energyFrom converts a value typed in the display unit to kJ/mol.
export function energyFrom(v, unit) {
  return unit === "kcal" ? v * KCAL : v;
}

// unitLabel is the label of the energy unit.
export function unitLabel(unit) {
  return unit === "kcal" ? "kcal/mol" : "kJ/mol";
}

// num writes x with the given number of decimals and a true minus sign; null or non-finite gives "—".
export function num(x, digits = 1) {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  let s = x.toFixed(digits);
  if (/^-0(\.0*)?$/.test(s)) s = s.slice(1); // no "−0.0"
  return s.replace("-", MINUS);
}

// signed is num with a leading "+" for positive values.
export function signed(x, digits = 1) {
  const s = num(x, digits);
  return x > 0 && s !== "—" && !/^0(\.0*)?$/.test(s) ? "+" + s : s;
}

// energy writes a kJ/mol value in the display unit.
export function energy(kj, unit, digits = 1) {
  return kj === null || kj === undefined ? "—" : num(energyIn(kj, unit), digits);
}

const SUPER = { "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹", "-": "⁻" };

// superscript writes an integer with superscript digits.
export function superscript(n) {
  return String(n).split("").map((c) => SUPER[c] ?? c).join("");
}

// powerOfTen writes 10^log10 as "3.2 × 10⁵", or plainly when it is between 0.001 and 1000. It works from
// the logarithm so that values beyond the range of doubles still print.
export function powerOfTen(log10) {
  if (log10 === null || log10 === undefined || !Number.isFinite(log10)) return "—";
  if (log10 > -3 && log10 < 3) {
    const v = Math.pow(10, log10);
    return v >= 100 ? v.toFixed(0) : v >= 1 ? v.toPrecision(3) : v.toPrecision(2);
  }
  let e = Math.floor(log10);
  let m = Math.pow(10, log10 - e);
  if (m >= 9.95) { m = 1; e += 1; }
  return `${m.toFixed(1)} × 10${superscript(e)}`;
}

// molar writes a concentration given in mol/L with a convenient unit.
export function molar(m) {
  if (m === null || m === undefined || !Number.isFinite(m)) return "—";
  const units = [[1, "M"], [1e-3, "mM"], [1e-6, "µM"], [1e-9, "nM"], [1e-12, "pM"]];
  for (const [f, u] of units) {
    if (m >= f * 0.9995) return `${trimZeros((m / f).toPrecision(3))} ${u}`;
  }
  return `${m.toExponential(2)} M`;
}

function trimZeros(s) {
  return s.includes(".") && !s.includes("e") ? s.replace(/\.?0+$/, "") : s;
}

// readNumber reads a number the user typed: decimals ("0.25", "-1.5e3", with "−" or "," accepted for
// minus and decimal comma) or a fraction "1/2". It returns {value} or {error} with a message.
export function readNumber(text) {
  const t = text.trim().replace(/\u2212/g, "-").replace(/^\+/, "");
  if (t === "") return { empty: true };
  const frac = /^(-?\d+)\s*\/\s*(\d+)$/.exec(t);
  if (frac) {
    const d = Number(frac[2]);
    if (d === 0) return { error: "a fraction cannot have 0 below the line" };
    return { value: Number(frac[1]) / d };
  }
  const dec = t.replace(/^(-?\d+),(\d+)$/, "$1.$2");
  if (!/^-?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(dec)) {
    return { error: `"${text.trim()}" is not a number` };
  }
  const v = Number(dec);
  if (!Number.isFinite(v)) return { error: `"${text.trim()}" is too large` };
  return { value: v };
}

// editText writes a number for an editable field: as short as it can be without losing what was stored.
export function editText(x) {
  if (x === null || x === undefined) return "";
  return String(Number(x.toPrecision(12)));
}

// codeUnitOffset turns a 1-based column counted in characters (code points), as the engine reports it,
// into an offset in the JavaScript string (UTF-16 code units).
export function codeUnitOffset(text, column) {
  let off = 0;
  let col = 1;
  for (const ch of text) {
    if (col >= column) break;
    off += ch.length;
    col++;
  }
  return off;
}

// el makes an element: el("td", {class: "x", title: "y"}, child, "text", ...).
export function el(tag, attrs, ...children) {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs ?? {})) {
    if (v === null || v === undefined || v === false) continue;
    if (k === "class") e.className = v;
    else if (k === "text") e.textContent = v;
    else if (k.startsWith("on")) e.addEventListener(k.slice(2), v);
    else e.setAttribute(k, v === true ? "" : v);
  }
  for (const c of children) {
    if (c === null || c === undefined || c === false) continue;
    e.append(c);
  }
  return e;
}
