// Every source tag used in code and tests, with the publication it stands
// for. A figure or rule carries one of these tags beside it; tests cite the
// same tags. The reference page lists them.

/** One source: what the tag means and the publication(s) behind it. */
export interface SourceEntry {
  readonly tag: string;
  readonly title: string;
  /** Publication, edition and year; or what kind of knowledge it is. */
  readonly publication: string;
  /** A publication (checkable), a rule of thumb, our own rule, or recall to verify. */
  readonly kind: "publication" | "common-practice" | "product-rule" | "from-memory";
}

/**
 * The sources. Handbook titles that contain a maker's or brand name are given
 * by editor and edition only.
 */
export const SOURCES: readonly SourceEntry[] = [
  {
    tag: "REG",
    title: "Registered receiving-tube characteristics",
    publication:
      "RMA/RETMA/EIA (later JEDEC) registered characteristics as printed in makers' data sheets and US receiving-tube manuals, 1950–1975; cross-checked in Radio Valve Data, compiled by the staff of Wireless World, 7th edition, Iliffe, 1961.",
    kind: "publication",
  },
  {
    tag: "MIL-E-1",
    title: "US military electron-tube specification",
    publication:
      "MIL-E-1, Electron Tubes, general specification and its individual type sheets (US Department of Defense), editions 1950s–1970s.",
    kind: "publication",
  },
  {
    tag: "EU-DS",
    title: "European valve data books",
    publication:
      "European makers' valve data books and handbooks, 1950s–1960s (mutual conductance in mA/V; 1 mA/V = 1,000 µmho); cross-checked in Radio Valve Data, 7th edition, 1961.",
    kind: "publication",
  },
  {
    tag: "PE",
    title: "European designation scheme",
    publication:
      "The joint European valve designation system of 1934, continued as the Pro Electron type designation scheme (Pro Electron, Brussels, from 1966).",
    kind: "publication",
  },
  {
    tag: "LS53",
    title: "Radio designer's handbook, 4th edition",
    publication:
      "F. Langford-Smith (ed.), radio designer's handbook, 4th edition, 1953 (the title begins with a maker's name, omitted here); chapter on valve designations and characteristics.",
    kind: "publication",
  },
  {
    tag: "EIA-476",
    title: "Date-code marking and source-code registers",
    publication: "EIA Standard EIA-476, Date Code Marking; and the RMA/EIA source-code registers, 1946–2001.",
    kind: "publication",
  },
  {
    tag: "RFC-4180",
    title: "CSV format",
    publication: "IETF RFC 4180, Common Format and MIME Type for Comma-Separated Values (CSV) Files, 2005.",
    kind: "publication",
  },
  {
    tag: "RFC-3986",
    title: "URI syntax",
    publication: "IETF RFC 3986, Uniform Resource Identifier (URI): Generic Syntax, §2.1 Percent-Encoding, 2005.",
    kind: "publication",
  },
  {
    tag: "OWASP-AUTH",
    title: "Authentication and account enumeration",
    publication:
      'OWASP Cheat Sheet Series, Authentication Cheat Sheet, "Authentication and Error Messages" (the same answer whether or not an account exists, account creation included).',
    kind: "publication",
  },
  {
    tag: "UAX-9",
    title: "Unicode bidirectional algorithm",
    publication:
      "Unicode Standard Annex #9, Unicode Bidirectional Algorithm (explicit embeddings, overrides and isolates, U+202A–U+202E and U+2066–U+2069), revision for Unicode 15.1, 2023.",
    kind: "publication",
  },
  {
    tag: "UNI-23",
    title: "Unicode control codes",
    publication:
      'The Unicode Standard, Version 15.1, chapter 23 "Special Areas and Format Characters", §23.1 Control Codes (C0 U+0000–U+001F, DEL U+007F, C1 U+0080–U+009F), 2023.',
    kind: "publication",
  },
  {
    tag: "ISO-3166",
    title: "Country codes",
    publication:
      "ISO 3166-1:2020, Codes for the representation of names of countries and their subdivisions — Part 1: Country code (alpha-2).",
    kind: "publication",
  },
  {
    tag: "PG-INT",
    title: "Integer column range",
    publication: "PostgreSQL documentation, section 8.1.1 Integer Types: integer is −2147483648 to +2147483647.",
    kind: "publication",
  },
  {
    tag: "CTP",
    title: "Common trade practice",
    publication:
      "Common practice among dealers and service technicians; a rule of thumb with no single published source.",
    kind: "common-practice",
  },
  {
    tag: "SUG",
    title: "Getterline product rule",
    publication: "A rule of our own product design, not a fact about valves.",
    kind: "product-rule",
  },
  {
    tag: "MEM",
    title: "From memory",
    publication:
      "Recalled from memory by the compiler; verify against the data sheet named by the row's other tag before relying on it.",
    kind: "from-memory",
  },
];

/** Tags of SOURCES, for validation. */
export const SOURCE_TAGS: readonly string[] = SOURCES.map((s) => s.tag);

/** The entry for a tag, or undefined. */
export function sourceEntry(tag: string): SourceEntry | undefined {
  return SOURCES.find((s) => s.tag === tag);
}

/** A row's source string read into its parts. */
export interface ParsedRowSource {
  /** Publication tags, e.g. ["MIL-E-1", "REG"]; empty for bare "MEM". */
  readonly tags: readonly string[];
  /** "checked": ✓ against a published sheet; "memory": recalled, verify; "memory-low": low confidence; "stated": the tag alone. */
  readonly mark: "checked" | "memory" | "memory-low" | "stated";
}

const ROW_SOURCE = /^(?:([A-Z0-9-]+(?:\/[A-Z0-9-]+)*)(?: (✓|MEM\??))?|(MEM\??))$/;

/**
 * Reads a row source string ("REG ✓", "EU-DS MEM?", "MIL-E-1/REG MEM",
 * "CTP", "MEM"). Undefined when it does not follow the form or names a tag
 * not in SOURCES.
 */
export function parseRowSource(source: string): ParsedRowSource | undefined {
  const bare = /^MEM(\?)?$/.exec(source.trim());
  if (bare) return { tags: [], mark: bare[1] ? "memory-low" : "memory" };
  const m = ROW_SOURCE.exec(source.trim());
  if (!m) return undefined;
  if (m[3]) return { tags: [], mark: m[3] === "MEM?" ? "memory-low" : "memory" };
  const tags = m[1]!.split("/");
  if (!tags.every((t) => SOURCE_TAGS.includes(t))) return undefined;
  const mark = m[2] === "✓" ? "checked" : m[2] === "MEM" ? "memory" : m[2] === "MEM?" ? "memory-low" : "stated";
  return { tags, mark };
}

/** Plain words for a row source, for people: "REG, from memory (verify)". */
export function describeRowSource(source: string): string {
  const p = parseRowSource(source);
  if (!p) return source;
  const where = p.tags.length ? p.tags.join(" / ") : "no publication named";
  const how = {
    checked: "checked against a published data sheet",
    memory: "from memory (verify)",
    "memory-low": "from memory, low confidence",
    stated: "as published",
  }[p.mark];
  return `${where}, ${how}`;
}
