/** A stable number per object identity, for keying computations on results without hashing them. */
const ids = new WeakMap<object, number>();
let next = 1;

export function objectId(value: object): number {
  let id = ids.get(value);
  if (id === undefined) {
    id = next++;
    ids.set(value, id);
  }
  return id;
}
