#!/usr/bin/env node
// The outage assistant of the Riverton city water utility (invented example data).
const dedent = (strings) => strings.join("");
const METER = /^[A-Z]{2}-\d{4}$|"|'|`/;

/* tare: prompt calls_per_day=12000
   tare: var area=8 since="since 6 a.m." */
const OUTAGE_PROMPT = `You are the outage desk of Riverton Water.
The outage in ${area} has lasted ${since}. Nested: ${areas.map((a) => `zone ${a}`).join(", ")}.
Say "sorry" once, and give the repair crew's estimate: ${estimate ?? "unknown"}.`;

const ratio = usage / 2 / days;
const request = {
  model: "riverton-small",
  system: 'Answer only questions about outages, pressure and water quality. Don\'t guess.',
  messages: [{ role: "user", content: `Is there an outage at ${street}?` }],
};

const buildNotice = (street, hours) =>
  "Crews are working on " + street + ". Water should return within " + hours + " hours, we expect.";

const SMS_TEMPLATE = dedent`Riverton Water: the supply on your street is back. Reply STOP to end these messages.`;

const RAW_PROMPT_NOTE = String.raw`Paths like C:\new\table stay as written in the outage log template.`;

function report(street) {
  console.log(`Prompt for ${street} sent with ${ratio} tokens to the model`);
  if (!street) throw new Error("The street name is missing from the outage report form");
  const notesPrompt = `Unicode in outage notes: caf\u00e9 \u{1F6B0} \x41 and a line \
continued.` + ' A \0 null, \\ a backslash.';
  return notesPrompt;
}
