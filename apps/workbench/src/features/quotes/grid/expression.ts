/**
 * Simple arithmetic typed into a numeric cell: numbers, + - * /, unary minus, brackets
 * ("3*12.5", "(2+3)*4.2", "120/3"). Parsed with jsep into a syntax tree and evaluated here
 * over those node kinds only: names, calls, member access, strings and every other operator
 * are refused, so no text typed into a cell ever runs as code.
 */
import jsep from 'jsep';

export type ExpressionResult = { ok: true; value: number } | { ok: false; error: string };

const MAX_LENGTH = 200;

function evaluate(node: jsep.Expression): number {
  switch (node.type) {
    case 'Literal': {
      const value = (node as jsep.Literal).value;
      if (typeof value !== 'number') throw new Error('Only numbers can be used.');
      return value;
    }
    case 'UnaryExpression': {
      const u = node as jsep.UnaryExpression;
      const v = evaluate(u.argument);
      if (u.operator === '-') return -v;
      if (u.operator === '+') return v;
      throw new Error(`"${u.operator}" is not allowed; use + - * / and brackets.`);
    }
    case 'BinaryExpression': {
      const b = node as jsep.BinaryExpression;
      const l = evaluate(b.left);
      const r = evaluate(b.right);
      switch (b.operator) {
        case '+':
          return l + r;
        case '-':
          return l - r;
        case '*':
          return l * r;
        case '/':
          if (r === 0) throw new Error('Cannot divide by zero.');
          return l / r;
        default:
          throw new Error(`"${b.operator}" is not allowed; use + - * / and brackets.`);
      }
    }
    default:
      throw new Error('Use numbers with + - * / and brackets only.');
  }
}

/** Evaluate arithmetic text to a finite number, or say what is wrong with it. */
export function evaluateArithmetic(text: string): ExpressionResult {
  const source = text.trim();
  if (source === '') return { ok: false, error: 'Enter a number.' };
  if (source.length > MAX_LENGTH) return { ok: false, error: `At most ${MAX_LENGTH} characters.` };
  // jsep reads "0x10", "1e3" and ".5": keep to plain decimals so what is typed is what is meant.
  if (!/^[\d\s.+\-*/()]+$/.test(source)) return { ok: false, error: 'Use numbers with + - * / and brackets only.' };
  let tree: jsep.Expression;
  try {
    tree = jsep(source);
  } catch {
    return { ok: false, error: `"${source}" is not a sum Gloaming can work out.` };
  }
  try {
    const value = evaluate(tree);
    if (!Number.isFinite(value)) return { ok: false, error: 'That works out too large.' };
    return { ok: true, value };
  } catch (err) {
    return { ok: false, error: err instanceof Error ? err.message : 'Not a sum.' };
  }
}

/**
 * Arithmetic text to an integer scaled by 10^digits (pence, thousandths, basis points),
 * rounded half away from zero at that scale. Plain decimals skip the float path entirely.
 */
export function evaluateScaled(text: string, digits: number): ExpressionResult {
  const source = text.trim();
  const plain = /^(\d+)(?:\.(\d*))?$/.exec(source);
  if (plain && (plain[2] ?? '').length <= digits) {
    const value = Number((plain[1] ?? '0') + (plain[2] ?? '').padEnd(digits, '0'));
    return Number.isSafeInteger(value) ? { ok: true, value } : { ok: false, error: 'That number is too large.' };
  }
  const r = evaluateArithmetic(source);
  if (!r.ok) return r;
  const scaled = r.value * 10 ** digits;
  // Remove float noise (0.1+0.2) before rounding at the cell's precision.
  const rounded = Math.sign(scaled) * Math.round(Math.abs(Number(scaled.toPrecision(15))));
  if (!Number.isSafeInteger(rounded)) return { ok: false, error: 'That works out too large.' };
  return { ok: true, value: rounded + 0 };
}
