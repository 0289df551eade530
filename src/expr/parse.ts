/**
 * Lexer and recursive-descent parser for the expression language.
 *
 * Grammar (lowest precedence first):
 *   expression := sum [ ('<' | '<=' | '>' | '>=' | '==' | '!=') sum ]     (one comparison, no chains)
 *   sum        := product { ('+' | '-') product }
 *   product    := unary { ('*' | '/') unary }
 *   unary      := ('-' | '+') unary | power
 *   power      := primary [ '^' unary ]                                      (right-associative)
 *   primary    := number | 'x' | 'y' | 'pi' | 'e' | function '(' expression { ',' expression } ')'
 *               | '(' expression ')'
 * so -x^2 = -(x^2), 2^3^2 = 2^9, 2^-1 = 0.5. Numbers: 12, 1.5, .5, 1., 1e-3, 2.5E+4.
 * Every failure is an InputError(where, '... at column N; expected ...').
 */
import { InputError } from '../base/errors.js';
import {
  CONSTANTS,
  FUNCTIONS,
  isConstantName,
  isFunctionName,
  type CompareOp,
  type ExprNode,
} from './ast.js';
import { editDistance } from '../base/text.js';

/** Longest accepted expression text, in UTF-16 code units. */
export const MAX_EXPRESSION_LENGTH = 4000;
/** Deepest accepted nesting of parentheses, calls and unary operators. */
export const MAX_NESTING = 100;

type Token =
  | { t: 'num'; value: number; pos: number; text: string }
  | { t: 'name'; name: string; pos: number }
  | { t: 'op'; op: string; pos: number }
  | { t: 'end'; pos: number }
  | { t: 'bad'; error: InputError; pos: number };

const OPERATORS = ['<=', '>=', '==', '!=', '<', '>', '+', '-', '*', '/', '^', '(', ')', ','];

function isDigit(c: string): boolean {
  return c >= '0' && c <= '9';
}
function isNameStart(c: string): boolean {
  return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c === '_';
}
function isNamePart(c: string): boolean {
  return isNameStart(c) || isDigit(c);
}

function showChar(ch: string): string {
  const cp = ch.codePointAt(0)!;
  const invisible = cp === 0xa0 || cp === 0xad || (cp >= 0x2000 && cp <= 0x200f) || (cp >= 0x2028 && cp <= 0x202f) || cp === 0x205f || cp === 0x3000 || cp === 0xfeff;
  if (cp < 0x20 || cp === 0x7f || (cp >= 0x80 && cp < 0xa0) || invisible) {
    return `character U+${cp.toString(16).toUpperCase().padStart(4, '0')}`;
  }
  return ch === '"' ? `character '"'` : `character "${ch}"`;
}

/**
 * Split into tokens. A lexical fault does not throw here: it ends the list with a 'bad' token that
 * the parser throws when it reaches it, so the earliest fault in the text is the one reported.
 */
function tokenize(text: string, where: string, column: (i: number) => number): Token[] {
  const tokens: Token[] = [];
  try {
    tokenizeInto(tokens, text, where, column);
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    tokens.push({ t: 'bad', error: e, pos: 0 });
    return tokens;
  }
  return tokens;
}

function tokenizeInto(tokens: Token[], text: string, where: string, column: (i: number) => number): void {
  let i = 0;
  const n = text.length;
  while (i < n) {
    const c = text[i]!;
    if (c === ' ' || c === '\t' || c === '\n' || c === '\r') {
      i++;
      continue;
    }
    const start = i;
    if (isDigit(c) || (c === '.' && i + 1 < n && isDigit(text[i + 1]!))) {
      while (i < n && isDigit(text[i]!)) i++;
      if (i < n && text[i] === '.') {
        i++;
        while (i < n && isDigit(text[i]!)) i++;
      }
      if (i < n && (text[i] === 'e' || text[i] === 'E')) {
        let j = i + 1;
        if (j < n && (text[j] === '+' || text[j] === '-')) j++;
        if (j < n && isDigit(text[j]!)) {
          while (j < n && isDigit(text[j]!)) j++;
          i = j;
        } else {
          throw new InputError(where, `incomplete exponent in number "${text.slice(start, j)}" at column ${column(start)}; expected digits after "${text.slice(i, j)}"${j === i + 1 ? ` (write ${text.slice(start, i)}*e to multiply by e)` : ''}`);
        }
      }
      const lexeme = text.slice(start, i);
      const value = Number(lexeme);
      if (!Number.isFinite(value)) {
        throw new InputError(where, `number "${lexeme}" at column ${column(start)} is too large; expected a finite number`);
      }
      if (i < n && (isNameStart(text[i]!) || text[i] === '.')) {
        const what = text[i] === '.' ? 'second "."' : `name "${text.slice(i).match(/^[A-Za-z_0-9]+/)![0]}"`;
        throw new InputError(where, `unexpected ${what} right after number "${lexeme}" at column ${column(i)}; expected an operator (write 2*x, not 2x)`);
      }
      tokens.push({ t: 'num', value, pos: column(start), text: lexeme });
      continue;
    }
    if (isNameStart(c)) {
      while (i < n && isNamePart(text[i]!)) i++;
      tokens.push({ t: 'name', name: text.slice(start, i), pos: column(start) });
      continue;
    }
    const op = OPERATORS.find((o) => text.startsWith(o, i));
    if (op !== undefined) {
      tokens.push({ t: 'op', op, pos: column(start) });
      i += op.length;
      continue;
    }
    const ch = String.fromCodePoint(text.codePointAt(i)!);
    let hint = '';
    if (c === '=') hint = ' (use == to compare)';
    else if (c === '!') hint = ' (use != to compare)';
    else if (c === '\u2212') hint = ' (use the ASCII minus sign -)';
    else if (c === '\u00d7' || c === '\u22c5' || c === '\u00b7') hint = ' (use * to multiply)';
    else if (c === '\u00f7') hint = ' (use / to divide)';
    else if (c === '&' || c === '|') hint = ' (there are no logical operators; nest if(...) instead)';
    throw new InputError(where, `unexpected ${showChar(ch)} at column ${column(start)}; expected a number, a name, an operator or a parenthesis${hint}`);
  }
  tokens.push({ t: 'end', pos: column(n) });
}

function describeToken(tok: Token): string {
  switch (tok.t) {
    case 'num':
      return `number "${tok.text}"`;
    case 'name':
      return `name "${tok.name}"`;
    case 'op':
      return `"${tok.op}"`;
    case 'end':
      return 'end of input';
    case 'bad':
      return 'a fault';
  }
}

const KNOWN_NAMES_HINT = 'expected x, y, pi, e or a function such as sin(...)';

/** Closest known name by edit distance (at most 2), for "did you mean". */
function suggestName(name: string): string | undefined {
  const candidates = ['x', 'y', ...Object.keys(CONSTANTS), ...Object.keys(FUNCTIONS)];
  const lower = name.toLowerCase();
  let best: string | undefined;
  let bestD = 3;
  for (const c of candidates) {
    const d = editDistance(lower, c);
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  // A one-letter name is one edit away from x, y and e alike: no useful guess.
  if (best !== undefined && name.length <= 1 && lower !== best) return undefined;
  return best;
}


class Parser {
  private k = 0;
  private depth = 0;
  constructor(
    private readonly tokens: Token[],
    private readonly where: string,
  ) {}

  private peek(): Token {
    const tok = this.tokens[this.k]!;
    if (tok.t === 'bad') throw tok.error;
    return tok;
  }
  private next(): Token {
    const tok = this.peek();
    this.k++;
    return tok;
  }
  private isOp(op: string): boolean {
    const tok = this.peek();
    return tok.t === 'op' && tok.op === op;
  }
  private fail(tok: Token, expected: string): never {
    throw new InputError(this.where, `unexpected ${describeToken(tok)} at column ${tok.pos}; expected ${expected}`);
  }
  private enter(pos: number): void {
    if (++this.depth > MAX_NESTING) {
      throw new InputError(this.where, `expression nested too deeply at column ${pos}; expected at most ${MAX_NESTING} levels of parentheses, calls and signs`);
    }
  }
  private leave(): void {
    this.depth--;
  }

  parseAll(): ExprNode {
    if (this.peek().t === 'end') {
      throw new InputError(this.where, 'empty expression; expected a number, x, y or a formula such as 7850 or 20 - 0.01*x');
    }
    const node = this.expression();
    const tok = this.peek();
    if (tok.t !== 'end') {
      if (tok.t === 'op' && tok.op === ')') {
        throw new InputError(this.where, `unmatched ")" at column ${tok.pos}; expected an operator or end of input`);
      }
      if (tok.t === 'op' && tok.op === ',') {
        throw new InputError(this.where, `unexpected "," at column ${tok.pos}; commas only separate function arguments`);
      }
      if (tok.t === 'op' && ['<', '<=', '>', '>=', '==', '!='].includes(tok.op)) {
        throw new InputError(this.where, `second comparison "${tok.op}" at column ${tok.pos}; comparisons do not chain, expected end of input (nest if(...) instead)`);
      }
      this.fail(tok, 'an operator or end of input');
    }
    return node;
  }

  private expression(): ExprNode {
    const left = this.sum();
    const tok = this.peek();
    if (tok.t === 'op' && ['<', '<=', '>', '>=', '==', '!='].includes(tok.op)) {
      this.next();
      const right = this.sum();
      return { kind: 'compare', op: tok.op as CompareOp, left, right, pos: tok.pos };
    }
    return left;
  }

  private sum(): ExprNode {
    let left = this.product();
    for (;;) {
      const tok = this.peek();
      if (tok.t === 'op' && (tok.op === '+' || tok.op === '-')) {
        this.next();
        const right = this.product();
        left = { kind: 'binary', op: tok.op, left, right, pos: tok.pos };
      } else {
        return left;
      }
    }
  }

  private product(): ExprNode {
    let left = this.unary();
    for (;;) {
      const tok = this.peek();
      if (tok.t === 'op' && (tok.op === '*' || tok.op === '/')) {
        this.next();
        const right = this.unary();
        left = { kind: 'binary', op: tok.op, left, right, pos: tok.pos };
      } else {
        return left;
      }
    }
  }

  private unary(): ExprNode {
    const tok = this.peek();
    if (tok.t === 'op' && (tok.op === '-' || tok.op === '+')) {
      this.next();
      this.enter(tok.pos);
      const arg = this.unary();
      this.leave();
      return tok.op === '-' ? { kind: 'negate', arg, pos: tok.pos } : arg;
    }
    return this.power();
  }

  private power(): ExprNode {
    const base = this.primary();
    const tok = this.peek();
    if (tok.t === 'op' && tok.op === '^') {
      this.next();
      this.enter(tok.pos);
      const exponent = this.unary();
      this.leave();
      return { kind: 'binary', op: '^', left: base, right: exponent, pos: tok.pos };
    }
    return base;
  }

  private primary(): ExprNode {
    const tok = this.next();
    if (tok.t === 'num') return { kind: 'number', value: tok.value, pos: tok.pos };
    if (tok.t === 'op' && tok.op === '(') {
      this.enter(tok.pos);
      if (this.isOp(')')) this.fail(this.peek(), 'an expression inside the parentheses');
      const inner = this.expression();
      const close = this.peek();
      if (!(close.t === 'op' && close.op === ')')) {
        if (close.t === 'end') {
          throw new InputError(this.where, `missing ")" at column ${close.pos} to close "(" at column ${tok.pos}`);
        }
        this.fail(close, `an operator or ")" to close "(" at column ${tok.pos}`);
      }
      this.next();
      this.leave();
      return inner;
    }
    if (tok.t === 'name') {
      const name = tok.name;
      if (name === 'x' || name === 'y') return { kind: 'variable', name, pos: tok.pos };
      if (isConstantName(name)) return { kind: 'constant', name, value: CONSTANTS[name]!, pos: tok.pos };
      if (isFunctionName(name)) {
        const open = this.peek();
        if (!(open.t === 'op' && open.op === '(')) {
          throw new InputError(this.where, `function "${name}" at column ${tok.pos} needs its arguments; expected "(" after it, got ${describeToken(open)}`);
        }
        this.next();
        this.enter(open.pos);
        const args: ExprNode[] = [];
        if (this.isOp(')')) {
          // fall through to the count check with zero arguments
        } else {
          for (;;) {
            args.push(this.expression());
            const sep = this.peek();
            if (sep.t === 'op' && sep.op === ',') {
              this.next();
              continue;
            }
            if (sep.t === 'op' && sep.op === ')') break;
            if (sep.t === 'end') {
              throw new InputError(this.where, `missing ")" at column ${sep.pos} to close "${name}(" at column ${tok.pos}`);
            }
            this.fail(sep, `"," or ")" in the arguments of ${name}(...) opened at column ${open.pos}`);
          }
        }
        this.next(); // ')'
        this.leave();
        const info = FUNCTIONS[name];
        if (args.length < info.min || args.length > info.max) {
          const want =
            info.max === Infinity
              ? `at least ${info.min} arguments`
              : info.min === 1
                ? '1 argument'
                : `${info.min} arguments`;
          const got = args.length === 1 ? '1 argument' : `${args.length} arguments`;
          throw new InputError(this.where, `${name}(...) at column ${tok.pos} takes ${want}, got ${got}`);
        }
        return { kind: 'call', name, args, pos: tok.pos };
      }
      const guess = suggestName(name);
      const hint = guess !== undefined && guess !== name ? `; did you mean "${guess}"?` : '';
      const after = this.tokens[this.k];
      if (after !== undefined && after.t === 'op' && after.op === '(') {
        throw new InputError(this.where, `unknown function "${name}" at column ${tok.pos}; expected one of ${Object.keys(FUNCTIONS).join(', ')}${hint}`);
      }
      throw new InputError(this.where, `unknown name "${name}" at column ${tok.pos}; ${KNOWN_NAMES_HINT}${hint}`);
    }
    if (tok.t === 'end') {
      throw new InputError(this.where, `unexpected end of input at column ${tok.pos}; expected a number, a name or "("`);
    }
    if (tok.t === 'op' && tok.op === ')') this.fail(tok, 'a number, a name or "(" before ")"');
    return this.fail(tok, 'a number, a name or "("');
  }
}

/**
 * Parse `text` into a checked syntax tree. Throws InputError(where, detail) on any fault;
 * the detail names the 1-based column and what was expected.
 */
export function parseExpression(text: string, where: string): ExprNode {
  if (typeof text !== 'string') {
    throw new InputError(where, `expected an expression as a string, got ${typeof text}`);
  }
  if (text.length > MAX_EXPRESSION_LENGTH) {
    throw new InputError(where, `expression is ${text.length} characters long; expected at most ${MAX_EXPRESSION_LENGTH}`);
  }
  // Columns count Unicode code points, so a character outside the BMP counts once.
  const columns = new Int32Array(text.length + 1);
  let col = 1;
  for (let k = 0; k <= text.length; k++) {
    columns[k] = col;
    const cu = text.charCodeAt(k);
    const isHigh = cu >= 0xd800 && cu <= 0xdbff;
    const nextIsLow = k + 1 < text.length && text.charCodeAt(k + 1) >= 0xdc00 && text.charCodeAt(k + 1) <= 0xdfff;
    if (!(isHigh && nextIsLow)) col++;
  }
  const column = (i: number): number => columns[i]!;
  const tokens = tokenize(text, where, column);
  return new Parser(tokens, where).parseAll();
}
