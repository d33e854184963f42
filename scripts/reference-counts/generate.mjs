// Generates src/test/resources/reference-counts/tiktoken-vectors.json
// (relative to the repository root) from the strings in strings.mjs, using
// the tiktoken npm package (WASM build of the reference BPE tokenizer).
//
//   cd scripts/reference-counts && npm ci && node generate.mjs
//
// Special-token text such as "<|endoftext|>" is encoded as ORDINARY text:
// enc.encode(text, [], []) -- nothing allowed as special, nothing disallowed,
// so it is split into ordinary tokens and never throws.

import { readFileSync, writeFileSync, mkdirSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { get_encoding } from "tiktoken";
import { cases } from "./strings.mjs";

const here = dirname(fileURLToPath(import.meta.url));
const repoRoot = join(here, "..", "..");
const outFile = join(repoRoot, "src", "test", "resources", "reference-counts", "tiktoken-vectors.json");

const ENCODINGS = ["o200k_base", "cl100k_base", "p50k_base", "r50k_base"];
const IDS_FOR = ["o200k_base", "r50k_base"];
// Token id arrays are included only for texts shorter than this many
// characters (Unicode code points).
const IDS_MAX_CHARS = 2000;

const tiktokenVersion = JSON.parse(
  readFileSync(join(here, "node_modules", "tiktoken", "package.json"), "utf8"),
).version;

// ---- validate inputs
const seen = new Set();
for (const { id, text } of cases) {
  if (typeof text !== "string") throw new Error(`${id}: text is not a string`);
  if (!text.isWellFormed()) throw new Error(`${id}: text contains a lone surrogate`);
  if (seen.has(id)) throw new Error(`duplicate id ${id}`);
  seen.add(id);
}
if (cases.length < 220) throw new Error(`only ${cases.length} strings; need at least 220`);

// ---- encode
const encoders = Object.fromEntries(ENCODINGS.map((name) => [name, get_encoding(name)]));
const decoder = new TextDecoder("utf-8", { fatal: true, ignoreBOM: true });
const problems = [];
const vectors = [];
try {
  for (const { id, text } of cases) {
    const v = { id, text };
    const ids = {};
    for (const name of ENCODINGS) {
      const enc = encoders[name];
      let tokens;
      try {
        tokens = enc.encode(text, [], []);
      } catch (e) {
        problems.push(`${id} ${name}: encode threw: ${e?.message ?? e}`);
        throw e;
      }
      // Sanity check: the tokens must decode back to exactly the input.
      const round = decoder.decode(enc.decode(tokens));
      if (round !== text) problems.push(`${id} ${name}: decode(encode(text)) != text`);
      v[name] = tokens.length;
      ids[name] = Array.from(tokens);
    }
    if ([...text].length < IDS_MAX_CHARS) {
      for (const name of IDS_FOR) v[`${name}_ids`] = ids[name];
    }
    vectors.push(v);
  }
} finally {
  for (const enc of Object.values(encoders)) enc.free();
}

// ---- write
// JSON.stringify escapes U+0000..U+001F, quotes and backslashes. We also
// escape invisible / format / separator / private-use characters (and the
// whole of an astral one, as a surrogate-pair escape) so the committed file
// shows them and no editor or tool silently alters them. Other non-ASCII
// text (CJK, emoji, accents) stays as raw UTF-8 for readability. Any JSON
// parser reads both forms identically.
const ESCAPE = /[\p{Cc}\p{Cf}\p{Zs}\p{Zl}\p{Zp}\p{Co}\p{Cn}\p{Variation_Selector}]/gu;
function escapeInvisible(json) {
  return json.replace(ESCAPE, (ch) => {
    if (ch === " ") return ch;
    let out = "";
    for (let i = 0; i < ch.length; i++) {
      out += "\\u" + ch.charCodeAt(i).toString(16).toUpperCase().padStart(4, "0");
    }
    return out;
  });
}

const source = {
  package: "tiktoken",
  version: tiktokenVersion,
  generated: new Date().toISOString().slice(0, 10),
  generator: "scripts/reference-counts/generate.mjs",
  note: "special-token strings encoded as ordinary text: encode(text, [], [])",
};

const lines = [];
lines.push("{");
lines.push(`  "source": ${escapeInvisible(JSON.stringify(source))},`);
lines.push(`  "vectors": [`);
vectors.forEach((v, i) => {
  lines.push(`    ${escapeInvisible(JSON.stringify(v))}${i < vectors.length - 1 ? "," : ""}`);
});
lines.push("  ]");
lines.push("}");
const output = lines.join("\n") + "\n";

// Self-check: the file parses back to exactly what we meant to write.
const reparsed = JSON.parse(output);
if (JSON.stringify(reparsed.vectors) !== JSON.stringify(vectors)) {
  throw new Error("escaped output does not round-trip");
}

mkdirSync(dirname(outFile), { recursive: true });
writeFileSync(outFile, output, "utf8");

const bytes = Buffer.byteLength(output, "utf8");
console.log(`tiktoken ${tiktokenVersion}: wrote ${vectors.length} vectors, ${bytes} bytes -> ${outFile}`);
if (problems.length) {
  console.error(`${problems.length} problem(s):`);
  for (const p of problems) console.error("  " + p);
  process.exitCode = 1;
}
