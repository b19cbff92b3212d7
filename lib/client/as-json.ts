/** What JSON makes of a value: dates become ISO strings (as a route handler's answer carries them). */
export type AsJson<T> = T extends Date
  ? string
  : T extends (infer U)[]
    ? AsJson<U>[]
    : T extends readonly (infer U)[]
      ? readonly AsJson<U>[]
      : T extends object
        ? { [K in keyof T]: AsJson<T[K]> }
        : T;

/**
 * A server page's first data as plain props for a client component, in exactly the shape the API
 * returns for the same data (so the component's refresh from the API and its first render agree).
 */
export function asJson<T>(value: T): AsJson<T> {
  return JSON.parse(JSON.stringify(value)) as AsJson<T>;
}
