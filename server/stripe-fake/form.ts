// Parses Stripe's form encoding: a=1&a[b]=2&list[0]=x&list[]=y&metadata[k]=v, the same for query strings.
// Objects whose keys are all 0, 1, 2 … become arrays (except under `metadata`, whose keys are the caller's).
import { invalid } from "./errors";

/** A decoded parameter: a string, a list, or a nested hash. */
export type ParamValue = string | ParamValue[] | ParamHash;
/** A hash of decoded parameters. */
export interface ParamHash {
  [key: string]: ParamValue;
}

const MAX_PAIRS = 2000;
const MAX_DEPTH = 8;
const FORBIDDEN = new Set(["__proto__", "constructor", "prototype"]);

function decode(s: string): string {
  try {
    return decodeURIComponent(s.replace(/\+/g, " "));
  } catch {
    throw invalid("Invalid percent-encoding in the request body or query string.");
  }
}

/** Splits `a[b][0]` into ["a", "b", "0"]; `a[]` gives ["a", ""]. A key that is not bracket notation stays whole. */
function splitKey(key: string): string[] {
  const m = /^([^[\]]+)((?:\[[^[\]]*\])*)$/.exec(key);
  if (!m) return [key];
  const segs = [m[1]];
  for (const part of m[2].matchAll(/\[([^[\]]*)\]/g)) segs.push(part[1]);
  return segs;
}

function isHash(v: ParamValue | undefined): v is ParamHash {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function put(root: ParamHash, segs: string[], value: string, key: string): void {
  if (segs.length > MAX_DEPTH) throw invalid(`Parameter nested too deeply: ${key}`);
  let node: ParamHash | ParamValue[] = root;
  for (let i = 0; i < segs.length; i++) {
    const seg = segs[i];
    if (FORBIDDEN.has(seg)) throw invalid(`Invalid parameter name: ${key}`);
    const last = i === segs.length - 1;
    if (Array.isArray(node)) {
      // Only `a[]=x` builds real arrays while parsing; numbered keys build hashes converted at the end.
      if (seg !== "" || !last) throw invalid(`Invalid array parameter: ${key}`);
      node.push(value);
      return;
    }
    if (seg === "") throw invalid(`Invalid parameter name: ${key}`);
    if (last) {
      if (seg in node) throw invalid(`Parameter given more than once: ${key}`);
      node[seg] = value;
      return;
    }
    const wantArray = segs[i + 1] === "";
    let child: ParamValue | undefined = node[seg];
    if (child === undefined) {
      child = wantArray ? [] : {};
      node[seg] = child;
    }
    if (typeof child === "string" || Array.isArray(child) !== wantArray) {
      throw invalid(`Invalid ${wantArray ? "array" : "hash"} parameter: ${key}`);
    }
    node = child;
  }
}

/** Turns hashes keyed 0..n into arrays, recursively; leaves `metadata` hashes alone. */
function arrays(v: ParamValue, parentKey: string): ParamValue {
  if (Array.isArray(v)) return v.map((x) => arrays(x, ""));
  if (!isHash(v)) return v;
  const out: ParamHash = {};
  for (const [k, x] of Object.entries(v)) out[k] = arrays(x, k);
  const keys = Object.keys(out);
  if (parentKey !== "metadata" && keys.length > 0 && keys.every((k) => /^(0|[1-9]\d{0,3})$/.test(k))) {
    return keys
      .map(Number)
      .sort((a, b) => a - b)
      .map((i) => out[String(i)]);
  }
  return out;
}

/** Parses a form-encoded body or a query string (without the leading `?`). */
export function parseForm(input: string): ParamHash {
  const root: ParamHash = {};
  if (!input) return root;
  const pairs = input.split("&").filter((p) => p.length > 0);
  if (pairs.length > MAX_PAIRS) throw invalid("Too many parameters.");
  for (const pair of pairs) {
    const eq = pair.indexOf("=");
    const key = decode(eq === -1 ? pair : pair.slice(0, eq));
    const value = eq === -1 ? "" : decode(pair.slice(eq + 1));
    if (!key) continue;
    put(root, splitKey(key), value, key);
  }
  return arrays(root, "") as ParamHash;
}

/** Turns a parsed JSON body (used by the /_fake endpoints) into the same shape, every leaf a string. */
export function fromJson(value: unknown): ParamHash {
  const conv = (v: unknown): ParamValue => {
    if (Array.isArray(v)) return v.map(conv);
    if (v && typeof v === "object") {
      const out: ParamHash = {};
      for (const [k, x] of Object.entries(v)) {
        if (FORBIDDEN.has(k)) throw invalid(`Invalid parameter name: ${k}`);
        if (x !== undefined) out[k] = conv(x);
      }
      return out;
    }
    return v === null ? "" : String(v);
  };
  const out = conv(value);
  if (!isHash(out)) throw invalid("The JSON body must be an object.");
  return out;
}
