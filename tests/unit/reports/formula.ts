/**
 * A small spreadsheet-formula evaluator for the tests: enough of the Office Open XML formula grammar
 * (ECMA-376 Part 1, §18.17) for what the workbook writes: numbers, strings, cell and range references
 * (with sheet names, quoted or not, and $ anchors), workbook-level defined names, + − * / ^ with the
 * usual precedence (^ binds tighter than unary minus is NOT assumed: we only write parenthesised
 * powers), comparison =, and the functions SUM and IF. It lets a test change an input cell and
 * recalculate the sheet the way a spreadsheet program would, without one installed.
 */
import type ExcelJS from "exceljs";

type Value = number | string | boolean;

interface Ref {
  sheet: string;
  row: number;
  col: number;
}

function colNumber(letters: string): number {
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n;
}

function parseCellRef(s: string): { row: number; col: number } {
  const m = /^\$?([A-Z]+)\$?(\d+)$/i.exec(s);
  if (!m) throw new Error(`bad cell reference ${s}`);
  return { col: colNumber(m[1]!), row: Number(m[2]) };
}

export class WorkbookEvaluator {
  private readonly cache = new Map<string, Value>();
  private readonly overrides = new Map<string, Value>();
  private readonly names = new Map<string, Ref>();

  constructor(private readonly wb: ExcelJS.Workbook) {
    for (const entry of (wb.definedNames as unknown as { model: { name: string; ranges: string[] }[] })
      .model) {
      const range = entry.ranges[0];
      if (!range) continue;
      const bang = range.lastIndexOf("!");
      const sheet = range.slice(0, bang).replace(/^'|'$/g, "").replace(/''/g, "'");
      this.names.set(entry.name.toLowerCase(), { sheet, ...parseCellRef(range.slice(bang + 1)) });
    }
  }

  nameRef(name: string): Ref | undefined {
    return this.names.get(name.toLowerCase());
  }

  /** Replace a cell's value (as a user typing into it) and forget every computed value. */
  set(sheet: string, row: number, col: number, v: Value): void {
    this.overrides.set(`${sheet}!${row}:${col}`, v);
    this.cache.clear();
  }

  setName(name: string, v: Value): void {
    const r = this.nameRef(name);
    if (!r) throw new Error(`no defined name ${name}`);
    this.set(r.sheet, r.row, r.col, v);
  }

  value(sheet: string, row: number, col: number): Value {
    const key = `${sheet}!${row}:${col}`;
    const o = this.overrides.get(key);
    if (o !== undefined) return o;
    const hit = this.cache.get(key);
    if (hit !== undefined) return hit;
    const ws = this.wb.getWorksheet(sheet);
    if (!ws) throw new Error(`no sheet ${sheet}`);
    const cell = ws.getCell(row, col);
    const v = cell.value as unknown;
    let out: Value;
    if (v === null || v === undefined) out = 0;
    else if (typeof v === "number" || typeof v === "string" || typeof v === "boolean") out = v;
    else if (typeof v === "object" && v !== null && "formula" in v)
      out = this.evaluate((v as { formula: string }).formula, sheet);
    else throw new Error(`unsupported cell value at ${key}`);
    this.cache.set(key, out);
    return out;
  }

  nameValue(name: string): Value {
    const r = this.nameRef(name);
    if (!r) throw new Error(`no defined name ${name}`);
    return this.value(r.sheet, r.row, r.col);
  }

  evaluate(formula: string, sheet: string): Value {
    const p = new Parser(formula.replace(/^=/, ""), sheet, this);
    const v = p.expression();
    p.end();
    return v;
  }
}

class Parser {
  private i = 0;
  constructor(
    private readonly s: string,
    private readonly sheet: string,
    private readonly ev: WorkbookEvaluator,
  ) {}

  private ws() {
    while (this.s[this.i] === " ") this.i++;
  }
  private peek(): string {
    this.ws();
    return this.s[this.i] ?? "";
  }
  private eat(ch: string): boolean {
    if (this.peek() === ch) {
      this.i++;
      return true;
    }
    return false;
  }
  end() {
    this.ws();
    if (this.i !== this.s.length) throw new Error(`unparsed tail "${this.s.slice(this.i)}" in ${this.s}`);
  }

  expression(): Value {
    const left = this.additive();
    if (this.eat("=")) {
      const right = this.additive();
      return typeof left === "string" || typeof right === "string"
        ? String(left).toLowerCase() === String(right).toLowerCase()
        : left === right;
    }
    return left;
  }
  private additive(): Value {
    let v: Value = this.term();
    for (;;) {
      if (this.eat("+")) v = num(v) + num(this.term());
      else if (this.eat("-")) v = num(v) - num(this.term());
      else return v;
    }
  }
  private term(): Value {
    let v: Value = this.unary();
    for (;;) {
      if (this.eat("*")) v = num(v) * num(this.unary());
      else if (this.eat("/")) v = num(v) / num(this.unary());
      else return v;
    }
  }
  private unary(): Value {
    if (this.eat("-")) return -num(this.unary());
    if (this.eat("+")) return num(this.unary());
    return this.power();
  }
  private power(): Value {
    const base = this.primary();
    if (this.eat("^")) return Math.pow(num(base), num(this.unary()));
    return base;
  }
  private primary(): Value {
    const c = this.peek();
    if (c === "(") {
      this.i++;
      const v = this.expression();
      if (!this.eat(")")) throw new Error(`missing ) in ${this.s}`);
      return v;
    }
    if (c === '"') {
      const end = this.s.indexOf('"', this.i + 1);
      const v = this.s.slice(this.i + 1, end);
      this.i = end + 1;
      return v;
    }
    const numMatch = /^\d+(\.\d+)?([eE][+-]?\d+)?/.exec(this.s.slice(this.i));
    if (numMatch) {
      this.i += numMatch[0].length;
      return Number(numMatch[0]);
    }
    // Function call, sheet-qualified reference, plain reference or defined name.
    const refs = this.references();
    if (refs.kind === "call") return refs.value;
    if (refs.kind === "range") throw new Error(`a range outside a function in ${this.s}`);
    return refs.value;
  }

  private references(): { kind: "call" | "value"; value: Value } | { kind: "range" } {
    let sheet = this.sheet;
    let tokenStart = this.i;
    if (this.s[this.i] === "'") {
      const end = this.s.indexOf("'!", this.i + 1);
      sheet = this.s.slice(this.i + 1, end).replace(/''/g, "'");
      this.i = end + 2;
      tokenStart = this.i;
    }
    const m = /^[A-Za-z_$][A-Za-z0-9_$.]*/.exec(this.s.slice(this.i));
    if (!m) throw new Error(`unexpected "${this.s.slice(this.i)}" in ${this.s}`);
    this.i += m[0].length;
    if (this.s[this.i] === "!") {
      sheet = m[0];
      this.i++;
      return this.references2(sheet);
    }
    if (this.peek() === "(") return { kind: "call", value: this.call(m[0].toUpperCase()) };
    void tokenStart;
    if (/^\$?[A-Z]+\$?\d+$/i.test(m[0])) {
      const a = parseCellRef(m[0]);
      return { kind: "value", value: this.ev.value(sheet, a.row, a.col) };
    }
    return { kind: "value", value: this.ev.nameValue(m[0]) };
  }

  private references2(sheet: string): { kind: "value"; value: Value } {
    const m = /^\$?[A-Z]+\$?\d+/i.exec(this.s.slice(this.i));
    if (!m) throw new Error(`bad reference in ${this.s}`);
    this.i += m[0].length;
    const a = parseCellRef(m[0]);
    return { kind: "value", value: this.ev.value(sheet, a.row, a.col) };
  }

  /** Arguments: expressions, or ranges A1:B2 (same sheet) flattened to their values. */
  private args(): Value[][] {
    const out: Value[][] = [];
    this.eat("(");
    if (this.eat(")")) return out;
    for (;;) {
      const save = this.i;
      const range = /^\$?([A-Z]+)\$?(\d+):\$?([A-Z]+)\$?(\d+)/i.exec(this.s.slice(this.i).trimStart());
      if (range) {
        this.ws();
        this.i += range[0].length;
        const c0 = colNumber(range[1]!);
        const r0 = Number(range[2]);
        const c1 = colNumber(range[3]!);
        const r1 = Number(range[4]);
        const vals: Value[] = [];
        for (let r = r0; r <= r1; r++)
          for (let c = c0; c <= c1; c++) vals.push(this.ev.value(this.sheet, r, c));
        out.push(vals);
      } else {
        this.i = save;
        out.push([this.expression()]);
      }
      if (this.eat(",")) continue;
      if (this.eat(")")) return out;
      throw new Error(`bad argument list in ${this.s}`);
    }
  }

  private call(name: string): Value {
    const a = this.args();
    switch (name) {
      case "SUM":
        return a.flat().reduce<number>((s, v) => s + (typeof v === "number" ? v : 0), 0);
      case "IF":
        return truthy(a[0]?.[0]) ? (a[1]?.[0] ?? 0) : (a[2]?.[0] ?? false);
      default:
        throw new Error(`function ${name} not supported by the test evaluator`);
    }
  }
}

function num(v: Value): number {
  if (typeof v === "number") return v;
  if (typeof v === "boolean") return v ? 1 : 0;
  const n = Number(v);
  if (Number.isNaN(n)) throw new Error(`text "${v}" used as a number`);
  return n;
}

function truthy(v: Value | undefined): boolean {
  return v === true || (typeof v === "number" && v !== 0);
}
