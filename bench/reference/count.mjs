// The reference side of bench/compare.sh: counts the tokens of every file named in LIST (one path a
// line) with the tiktoken WASM tokenizer, in one process, the way `tare count` counts them: the file
// read as UTF-8, a leading byte-order mark left out, special-token strings counted as ordinary text
// (encode_ordinary).
//
//   node count.mjs LIST ENCODING...
//
// Prints one line per encoding: the encoding, the total tokens, and the seconds spent encoding
// (file reading excluded); the process as a whole is timed from outside.

import { readFileSync } from "node:fs";
import { get_encoding } from "tiktoken";

const [list, ...names] = process.argv.slice(2);
if (!list || names.length === 0) {
  console.error("usage: node count.mjs LIST ENCODING...");
  process.exit(2);
}

const paths = readFileSync(list, "utf8").split("\n").filter((line) => line.length > 0);
const decoder = new TextDecoder("utf-8", { fatal: true, ignoreBOM: true });
const encoders = names.map((name) => get_encoding(name));
const tokens = names.map(() => 0);
const nanos = names.map(() => 0n);

try {
  for (const path of paths) {
    let text = decoder.decode(readFileSync(path));
    if (text.startsWith("\uFEFF")) {
      text = text.slice(1);
    }
    for (let i = 0; i < encoders.length; i++) {
      const start = process.hrtime.bigint();
      tokens[i] += encoders[i].encode_ordinary(text).length;
      nanos[i] += process.hrtime.bigint() - start;
    }
  }
} finally {
  for (const encoder of encoders) {
    encoder.free();
  }
}

for (let i = 0; i < names.length; i++) {
  console.log(`${names[i]} ${tokens[i]} ${(Number(nanos[i]) / 1e9).toFixed(3)}`);
}
