// Decodes the wire format the official SDK sends: `application/x-www-form-urlencoded` with bracketed keys
// (`line_items[0][price_data][currency]=usd`, `expand[0]=x`, `metadata[k]=v`). Query strings of GET
// requests use the same encoding, so one parser serves both.

export type FormValue = string | FormValue[] | { [key: string]: FormValue };
export type FormObject = { [key: string]: FormValue };

/** Parses a bracketed form/query string into nested objects; index-only objects become arrays. */
export function parseBracketedForm(encoded: string): FormObject {
  const root: FormObject = {};
  for (const pair of encoded.split('&')) {
    if (pair === '') continue;
    const eq = pair.indexOf('=');
    const rawKey = eq === -1 ? pair : pair.slice(0, eq);
    const rawValue = eq === -1 ? '' : pair.slice(eq + 1);
    const key = decodeComponent(rawKey);
    const value = decodeComponent(rawValue);
    assign(root, splitKey(key), value);
  }
  return arraysFromIndexedObjects(root) as FormObject;
}

function decodeComponent(text: string): string {
  // Forms encode spaces as '+'; a malformed escape is kept literally rather than failing the request.
  const spaced = text.replace(/\+/g, ' ');
  try {
    return decodeURIComponent(spaced);
  } catch {
    return spaced;
  }
}

/** `a[b][0][]` → ['a', 'b', '0', '']; an empty segment means "append". */
function splitKey(key: string): string[] {
  const open = key.indexOf('[');
  if (open <= 0) return [key];
  const segments = [key.slice(0, open)];
  const rest = key.slice(open);
  const pattern = /\[([^\]]*)\]/g;
  let match: RegExpExecArray | null;
  let consumed = 0;
  while ((match = pattern.exec(rest)) !== null) {
    if (match.index !== consumed) break;
    segments.push(match[1]);
    consumed = match.index + match[0].length;
  }
  // Anything after the last well-formed bracket stays part of the last segment, like common parsers do.
  if (consumed < rest.length) segments[segments.length - 1] += rest.slice(consumed);
  return segments;
}

type Container = { [key: string]: FormValue | Container };

function assign(target: Container, segments: string[], value: string): void {
  let node: Container = target;
  for (let i = 0; i < segments.length - 1; i += 1) {
    const segment = segments[i] === '' ? String(nextIndex(node)) : segments[i];
    const existing = node[segment];
    if (typeof existing !== 'object' || existing === null || Array.isArray(existing)) {
      node[segment] = {};
    }
    node = node[segment] as Container;
  }
  const last = segments[segments.length - 1];
  node[last === '' ? String(nextIndex(node)) : last] = value;
}

function nextIndex(node: Container): number {
  const indexes = Object.keys(node).filter(isIndex).map(Number);
  return indexes.length === 0 ? 0 : Math.max(...indexes) + 1;
}

function isIndex(key: string): boolean {
  return /^(0|[1-9]\d*)$/.test(key);
}

function arraysFromIndexedObjects(value: FormValue | Container): FormValue {
  if (typeof value === 'string') return value;
  if (Array.isArray(value)) return value.map(arraysFromIndexedObjects);
  const keys = Object.keys(value);
  const converted: FormObject = {};
  for (const key of keys) converted[key] = arraysFromIndexedObjects(value[key]);
  if (keys.length > 0 && keys.every(isIndex)) {
    // Sparse indexes (a[0], a[5]) keep their order but lose the gaps, as the hosted API does.
    return keys
      .map(Number)
      .sort((a, b) => a - b)
      .map((index) => converted[String(index)]);
  }
  return converted;
}
