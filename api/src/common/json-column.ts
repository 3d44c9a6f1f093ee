/** MariaDB keeps JSON as LONGTEXT; the driver may hand back a string. Repositories read JSON columns through this. */
export function parseJson<T>(value: T | string): T {
  return typeof value === 'string' ? (JSON.parse(value) as T) : value;
}
