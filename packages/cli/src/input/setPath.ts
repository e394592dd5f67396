/**
 * Sets `value` at a dotted `path` of `target` (`load.r`), creating the objects on the way
 * (replacing a null or non-object held there). Changes `target`; used on fresh copies only.
 */
export function setPath(target: Record<string, unknown>, path: string, value: unknown): void {
  const keys = path.split('.');
  let node = target;
  keys.slice(0, -1).forEach((key) => {
    const next = node[key];
    if (typeof next !== 'object' || next === null || Array.isArray(next)) node[key] = {};
    node = node[key] as Record<string, unknown>;
  });
  node[keys[keys.length - 1] as string] = value;
}
