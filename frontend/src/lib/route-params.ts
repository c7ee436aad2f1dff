/** A record id from a route parameter: the positive integer it spells, or 0 when it is not one. */
export function idFrom(value: string | undefined): number {
  const id = Number(value);
  return Number.isInteger(id) && id > 0 ? id : 0;
}
