// How answers travel: JSON, where a time is an ISO 8601 string and a list comes as `{ items }`.

/** A time as JSON carries it: an ISO 8601 string in UTC, as `Date.prototype.toJSON` writes it. */
export type Timestamp = string;

/** A list answer: `{ items: [...] }`, so that fields can be added beside the list later. */
export interface ItemList<T> {
  items: T[];
}
