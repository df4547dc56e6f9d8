// Evaluates a trace entry's printed equation over its printed inputs, so a test can recompute
// every figure the trace shows. The syntax is the one the trace prints: `Tj = Ta + P·θJA·kair`,
// `D = M·√(K/(1 − M)), M = Vout/Vin` (definitions after the main equation), names as printed
// (they may hold commas and Unicode: `Tj,max`, `ΔIL`), · × * / + − -, ^, ², √, π, min, max, ln,
// log10, exp, abs.

const FUNCTIONS: Record<string, (...xs: number[]) => number> = {
  min: Math.min,
  max: Math.max,
  ln: Math.log,
  log10: Math.log10,
  exp: Math.exp,
  abs: Math.abs,
  sqrt: Math.sqrt,
};

class Parser {
  private pos = 0;
  private readonly names: string[];

  constructor(
    private readonly text: string,
    private readonly vars: Record<string, number>,
  ) {
    // Longest first, so `Tj,max` wins over `Tj` and `ΔIL` over `Δ`.
    this.names = Object.keys(vars).sort((a, b) => b.length - a.length);
  }

  parse(): number {
    const v = this.expr();
    this.space();
    if (this.pos < this.text.length) this.fail('unexpected text');
    return v;
  }

  private fail(why: string): never {
    throw new Error(`${why} at "${this.text.slice(this.pos)}" in "${this.text}"`);
  }

  private space(): void {
    while (this.pos < this.text.length && /\s/.test(this.text[this.pos]!)) this.pos += 1;
  }

  private peek(): string {
    this.space();
    return this.text[this.pos] ?? '';
  }

  private eat(ch: string): boolean {
    if (this.peek() === ch) {
      this.pos += ch.length;
      return true;
    }
    return false;
  }

  private expr(): number {
    let v = this.term();
    for (;;) {
      if (this.eat('+')) v += this.term();
      else if (this.eat('−') || this.eat('-')) v -= this.term();
      else return v;
    }
  }

  private term(): number {
    let v = this.unary();
    for (;;) {
      if (this.eat('·') || this.eat('×') || this.eat('*')) v *= this.unary();
      else if (this.eat('/')) v /= this.unary();
      else if (this.startsPrimary()) v *= this.unary();
      else return v;
    }
  }

  private startsPrimary(): boolean {
    const c = this.peek();
    if (c === '' || '+−-·×*/,)^²'.includes(c)) return false;
    return true;
  }

  private unary(): number {
    if (this.eat('−') || this.eat('-')) return -this.unary();
    return this.power();
  }

  private power(): number {
    let v = this.postfix();
    if (this.eat('^')) v = v ** this.unary();
    return v;
  }

  private postfix(): number {
    let v = this.primary();
    for (;;) {
      if (this.eat('²')) v *= v;
      else if (this.eat('³')) v = v * v * v;
      else return v;
    }
  }

  private primary(): number {
    this.space();
    if (this.eat('(')) {
      const v = this.expr();
      if (!this.eat(')')) this.fail('missing )');
      return v;
    }
    if (this.eat('√')) return Math.sqrt(this.postfix());
    if (this.eat('π')) return Math.PI;
    const rest = this.text.slice(this.pos);
    const name = this.names.find((n) => rest.startsWith(n));
    if (name !== undefined) {
      this.pos += name.length;
      return this.vars[name]!;
    }
    const call = /^([a-z][a-z0-9]*)\(/.exec(rest);
    if (call && FUNCTIONS[call[1]!]) {
      this.pos += call[0].length;
      const args = [this.expr()];
      while (this.eat(',')) args.push(this.expr());
      if (!this.eat(')')) this.fail('missing ) after arguments');
      return FUNCTIONS[call[1]!]!(...args);
    }
    const number = /^\d+(?:\.\d+)?(?:e[+-]?\d+)?/.exec(rest);
    if (number) {
      this.pos += number[0].length;
      return Number(number[0]);
    }
    return this.fail('unknown name');
  }
}

/** Splits at ", " outside parentheses: the main equation, then its definitions. */
function clauses(equation: string): string[] {
  const out: string[] = [];
  let depth = 0;
  let start = 0;
  for (let i = 0; i < equation.length; i += 1) {
    const c = equation[i];
    if (c === '(') depth += 1;
    else if (c === ')') depth -= 1;
    else if (c === ',' && equation[i + 1] === ' ' && depth === 0) {
      out.push(equation.slice(start, i));
      start = i + 2;
    }
  }
  out.push(equation.slice(start));
  return out;
}

function rightHandSide(clause: string): { name: string; rhs: string } {
  const at = clause.indexOf(' = ');
  if (at < 0) throw new Error(`no "=" in "${clause}"`);
  return { name: clause.slice(0, at).trim(), rhs: clause.slice(at + 3) };
}

/** The value the equation's right-hand side gives over the inputs; throws when the text is not a formula. */
export function evaluateEquation(equation: string, inputs: Record<string, number>): number {
  const [main, ...definitions] = clauses(equation);
  const vars = { ...inputs };
  for (const d of definitions) {
    const { name, rhs } = rightHandSide(d);
    vars[name] = new Parser(rhs, vars).parse();
  }
  return new Parser(rightHandSide(main!).rhs, vars).parse();
}
