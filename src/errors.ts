/**
 * Error classes. An InputError is the user's to fix (bad file, bad row, bad option): the CLI
 * prints its one-line message and exits with code 2. Anything else is a bug in talus: the CLI
 * prints the stack and exits with code 1.
 */

export interface InputErrorContext {
  /** File the problem was found in. */
  file?: string;
  /** 1-based line number in that file. */
  line?: number;
  /** Station id, when the problem belongs to a station. */
  station?: string;
  /** Column or option name. */
  field?: string;
}

export class InputError extends Error {
  readonly context: InputErrorContext;
  constructor(message: string, context: InputErrorContext = {}) {
    super(formatInputMessage(message, context));
    this.name = 'InputError';
    this.context = context;
  }
}

/** "file:line: station S: field F: message" with the parts that are known. */
export function formatInputMessage(message: string, ctx: InputErrorContext): string {
  const parts: string[] = [];
  if (ctx.file !== undefined) parts.push(ctx.line !== undefined ? `${ctx.file}:${ctx.line}` : ctx.file);
  if (ctx.station !== undefined) parts.push(`station ${ctx.station}`);
  if (ctx.field !== undefined) parts.push(`column ${ctx.field}`);
  return parts.length > 0 ? `${parts.join(': ')}: ${message}` : message;
}

export function isInputError(e: unknown): e is InputError {
  return e instanceof InputError || (e instanceof Error && e.name === 'InputError');
}
