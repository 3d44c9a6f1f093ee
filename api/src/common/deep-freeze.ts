/**
 * Freezes a value and everything inside it, so a copy shared by several requests cannot be changed
 * in place by one of them: a change throws instead (every module is strict).
 */
export function deepFreeze<T>(value: T): T {
  if (value === null || typeof value !== 'object' || Object.isFrozen(value)) return value;
  Object.freeze(value);
  for (const v of Object.values(value)) deepFreeze(v);
  return value;
}
