/**
 * Reads a form-encoded body with bracket keys (`line_items[0][price_data][currency]=cad`) into
 * nested objects and arrays: the encoding the payment SDK writes (stringifyRequestData in its
 * utils.js, the qs library's indexed array format).
 */
export type FormValue = string | FormValue[] | { [key: string]: FormValue };

export function parseFormBody(text: string): Record<string, FormValue> {
  const root: Record<string, FormValue> = {};
  for (const [rawKey, value] of new URLSearchParams(text)) {
    const parts = /^([^[]+)((?:\[[^\]]*\])*)$/.exec(rawKey);
    if (!parts) continue;
    const keys = [parts[1]!, ...[...parts[2]!.matchAll(/\[([^\]]*)\]/g)].map((m) => m[1]!)];
    let node: Record<string, FormValue> | FormValue[] = root;
    keys.forEach((key, i) => {
      const last = i === keys.length - 1;
      const slot = node as Record<string, FormValue>;
      if (last) {
        slot[key] = value;
        return;
      }
      const nextIsIndex = /^\d+$/.test(keys[i + 1]!);
      if (typeof slot[key] !== 'object' || slot[key] === null) slot[key] = nextIsIndex ? [] : {};
      node = slot[key] as Record<string, FormValue>;
    });
  }
  return root;
}
