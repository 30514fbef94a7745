/**
 * The shipped IBM Plex .woff files are the latin subset: Basic Latin, Latin-1 and a little general
 * punctuation (checked with fontkit's characterSet over every weight). Text outside it would print as
 * empty boxes, so user text is mapped to near equivalents first and anything else becomes "?".
 */
const EXTRA = new Set([
  0x131, 0x152, 0x153, 0x2bb, 0x2bc, 0x2c6, 0x2da, 0x2dc, 0x2013, 0x2014, 0x2018, 0x2019, 0x201a, 0x201c,
  0x201d, 0x201e, 0x2022, 0x2026, 0x2032, 0x2033, 0x2039, 0x203a, 0x2044, 0x20ac, 0x2122, 0x2191, 0x2193,
  0x2212, 0x2215,
]);

const REPLACE: Record<string, string> = {
  "≈": "~",
  "≤": "<=",
  "≥": ">=",
  "→": "->",
  "←": "<-",
  Δ: "delta ",
  Σ: "sum ",
  "√": "sqrt ",
  "∞": "infinity",
  "‰": " per mille",
  "\u2009": " ",
  "\u202f": " ",
  "\u2011": "-",
  "\u2010": "-",
  // Greek letters and marks of the methods text (Methods appendix) that the latin subset lacks.
  α: "alpha",
  β: "beta",
  γ: "gamma",
  δ: "delta",
  ε: "eps",
  η: "eta",
  θ: "theta",
  λ: "lambda",
  μ: "\u00b5",
  π: "pi",
  ρ: "rho",
  σ: "sigma",
  τ: "tau",
  φ: "phi",
  ω: "omega",
  "∝": " prop. to ",
  "∫": "integral ",
  "∂": "d",
  "ṁ": "m",
  "\u0307": "",
  "₀": "0",
  "₁": "1",
  "₂": "2",
  "₃": "3",
  "₄": "4",
  "₅": "5",
  "₆": "6",
  "₇": "7",
  "₈": "8",
  "₉": "9",
  "⁰": "^0",
  "⁴": "^4",
  "⁵": "^5",
  "⁶": "^6",
  "⁷": "^7",
  "⁸": "^8",
  "⁹": "^9",
  "⁻": "-",
  "⁺": "+",
  "ᵀ": "^T",
};

export function hasGlyph(cp: number): boolean {
  return (cp >= 0x20 && cp <= 0x7e) || (cp >= 0xa0 && cp <= 0xff) || EXTRA.has(cp);
}

/** Text the PDF fonts can draw. */
export function pdfText(s: string): string {
  let out = "";
  for (const ch of s) {
    const cp = ch.codePointAt(0) ?? 0x3f;
    if (hasGlyph(cp)) out += ch;
    else if (ch === "\n") out += ch;
    else if (REPLACE[ch] !== undefined) out += REPLACE[ch];
    else if (cp < 0x20) out += " ";
    else out += "?";
  }
  return out;
}
