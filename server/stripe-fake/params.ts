// Typed readers for decoded request parameters, answering Stripe's 400s for bad or unknown ones.
import { invalid, missingParam } from "./errors";
import type { ParamHash, ParamValue } from "./form";

/** Refuses any top-level parameter not in `allowed` (Stripe: "Received unknown parameter"). */
export function onlyParams(p: ParamHash, allowed: readonly string[], prefix = ""): void {
  for (const key of Object.keys(p)) {
    if (!allowed.includes(key)) {
      const name = prefix ? `${prefix}[${key}]` : key;
      throw invalid(`Received unknown parameter: ${name}`, name, "parameter_unknown");
    }
  }
}

function fullName(name: string, prefix: string): string {
  return prefix ? `${prefix}[${name}]` : name;
}

/** A string parameter, or undefined when absent. */
export function str(p: ParamHash, name: string, prefix = ""): string | undefined {
  const v = p[name];
  if (v === undefined) return undefined;
  if (typeof v !== "string")
    throw invalid(`Invalid string: ${fullName(name, prefix)} must be a string.`, fullName(name, prefix));
  return v;
}

/** A string parameter that must be present and non-empty. */
export function requiredStr(p: ParamHash, name: string, prefix = ""): string {
  const v = str(p, name, prefix);
  if (v === undefined) throw missingParam(fullName(name, prefix));
  if (v === "") {
    throw invalid(
      `You passed an empty string for '${fullName(name, prefix)}'. We assume empty values are an attempt to unset a parameter; however '${fullName(name, prefix)}' cannot be unset.`,
      fullName(name, prefix),
      "parameter_invalid_empty",
    );
  }
  return v;
}

/** A whole-number parameter within [min, max], or undefined when absent. */
export function int(
  p: ParamHash,
  name: string,
  opts: { min?: number; max?: number } = {},
  prefix = "",
): number | undefined {
  const raw = str(p, name, prefix);
  if (raw === undefined) return undefined;
  const param = fullName(name, prefix);
  if (!/^-?\d{1,15}$/.test(raw)) throw invalid(`Invalid integer: ${raw}`, param, "parameter_invalid_integer");
  const n = Number(raw);
  if (opts.min !== undefined && n < opts.min)
    throw invalid(`This value must be greater than or equal to ${opts.min}.`, param);
  if (opts.max !== undefined && n > opts.max)
    throw invalid(`This value must be less than or equal to ${opts.max}.`, param);
  return n;
}

/** A boolean parameter ("true" / "false"), or undefined when absent. */
export function bool(p: ParamHash, name: string, prefix = ""): boolean | undefined {
  const raw = str(p, name, prefix);
  if (raw === undefined) return undefined;
  if (raw === "true") return true;
  if (raw === "false") return false;
  throw invalid(`Invalid boolean: ${raw}`, fullName(name, prefix));
}

/** A string parameter restricted to `values`, or undefined when absent. */
export function oneOf<T extends string>(p: ParamHash, name: string, values: readonly T[], prefix = ""): T | undefined {
  const raw = str(p, name, prefix);
  if (raw === undefined) return undefined;
  if (!(values as readonly string[]).includes(raw)) {
    throw invalid(`Invalid ${fullName(name, prefix)}: must be one of ${values.join(", ")}`, fullName(name, prefix));
  }
  return raw as T;
}

/** A nested hash parameter, or undefined when absent. */
export function hash(p: ParamHash, name: string, prefix = ""): ParamHash | undefined {
  const v = p[name];
  if (v === undefined) return undefined;
  if (typeof v !== "object" || Array.isArray(v))
    throw invalid(`Invalid object: ${fullName(name, prefix)} must be a hash.`, fullName(name, prefix));
  return v;
}

/** A three-letter lowercase currency code (Stripe accepts any case and answers lowercase). */
export function currency(p: ParamHash, name = "currency", required = true): string | undefined {
  const raw = required ? requiredStr(p, name) : str(p, name);
  if (raw === undefined) return undefined;
  const c = raw.toLowerCase();
  if (!/^[a-z]{3}$/.test(c))
    throw invalid(`Invalid currency: ${raw}. Stripe currencies are three-letter ISO codes.`, name);
  return c;
}

/** The `expand` parameter as a list of dotted paths. */
export function expandPaths(p: ParamHash): string[] {
  const v: ParamValue | undefined = p.expand;
  if (v === undefined) return [];
  const list = Array.isArray(v) ? v : [v];
  return list.map((x) => {
    if (typeof x !== "string" || !x) throw invalid("Invalid expand: each entry must be a dotted field path.", "expand");
    return x;
  });
}

/**
 * Applies a `metadata` parameter: on create, sets keys; on update, merges, an empty value unsets a key and
 * `metadata=""` clears all. Stripe's limits: 50 keys, key ≤ 40 characters, value ≤ 500 characters.
 */
export function applyMetadata(p: ParamHash, existing: Record<string, string> = {}): Record<string, string> {
  const v = p.metadata;
  if (v === undefined) return existing;
  if (v === "") return {};
  if (typeof v !== "object" || Array.isArray(v))
    throw invalid("Invalid metadata: must be a hash of string keys and values.", "metadata");
  const out: Record<string, string> = { ...existing };
  for (const [k, x] of Object.entries(v)) {
    if (typeof x !== "string") throw invalid(`Invalid metadata[${k}]: values must be strings.`, `metadata[${k}]`);
    if (k.length > 40) throw invalid(`Metadata keys can be at most 40 characters long: ${k}`, `metadata[${k}]`);
    if (x.length > 500)
      throw invalid(`Metadata values can be at most 500 characters long (metadata[${k}]).`, `metadata[${k}]`);
    if (x === "") delete out[k];
    else out[k] = x;
  }
  if (Object.keys(out).length > 50) throw invalid("Metadata can have at most 50 keys.", "metadata");
  return out;
}
