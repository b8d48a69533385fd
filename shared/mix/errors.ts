/**
 * The one error type of the mix engine. Its message is written for the person who typed the
 * input (the API returns it as a 400 body), so it always names the component or field at fault.
 */
export class MixError extends Error {
  /** Name of the component at fault, when the problem belongs to one component. */
  readonly component: string | undefined;
  /** Input field at fault, e.g. "parts", "percentOf", "total", "unit". */
  readonly field: string | undefined;

  constructor(message: string, where: { component?: string; field?: string } = {}) {
    super(message);
    this.name = "MixError";
    this.component = where.component;
    this.field = where.field;
  }
}

/** Builds the message prefix: `Component "reducer": ` or `total: `. */
function prefix(field: string, component?: string): string {
  return component === undefined ? `${field}: ` : `Component "${component}": ${field} `;
}

function describe(value: unknown): string {
  return typeof value === "number" ? String(value) : JSON.stringify(value) ?? String(value);
}

/** Throws unless `value` is a finite number greater than zero. */
export function requirePositive(value: unknown, field: string, component?: string): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new MixError(
      `${prefix(field, component)}must be a finite number greater than 0 (got ${describe(value)})`,
      { component, field },
    );
  }
  return value;
}

/** Throws unless `value` is a finite number that is zero or more. */
export function requireNonNegative(value: unknown, field: string, component?: string): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0) {
    throw new MixError(
      `${prefix(field, component)}must be a finite number of 0 or more (got ${describe(value)})`,
      { component, field },
    );
  }
  return value;
}

/** Throws unless `value` is a finite percentage in (0, 100] (0 allowed when `allowZero`). */
export function requirePercent(
  value: unknown,
  field: string,
  { allowZero = false, component }: { allowZero?: boolean; component?: string } = {},
): number {
  const low = allowZero ? "from 0" : "greater than 0";
  if (
    typeof value !== "number" ||
    !Number.isFinite(value) ||
    value > 100 ||
    (allowZero ? value < 0 : value <= 0)
  ) {
    throw new MixError(`${prefix(field, component)}must be a percentage ${low} up to 100 (got ${describe(value)})`, {
      component,
      field,
    });
  }
  return value;
}

/** Throws unless `value` is a whole number of at least 1. */
export function requireCount(value: unknown, field: string): number {
  if (typeof value !== "number" || !Number.isInteger(value) || value < 1) {
    throw new MixError(`${field}: must be a whole number of 1 or more (got ${describe(value)})`, { field });
  }
  return value;
}

/** Throws unless `value` is a Date holding a real instant. */
export function requireDate(value: unknown, field: string): Date {
  if (!(value instanceof Date) || Number.isNaN(value.getTime())) {
    throw new MixError(`${field}: must be a valid date and time`, { field });
  }
  return value;
}
