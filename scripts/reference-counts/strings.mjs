import { readFileSync } from "node:fs";
// Test strings for the tiktoken reference vectors.
//
// Everything here is deterministic: no Math.random, no dates, no environment.
// Each entry gets a stable id "<category>-NNN" where NNN counts within its
// category in the order of this file. To keep existing ids stable, append new
// strings at the END of a category's block (or add a new category); do not
// insert in the middle or reorder.
//
// Invisible and unusual characters are written as \u escapes so this file
// stays readable. Every string must be well-formed Unicode (no lone
// surrogates); generate.mjs checks this and fails otherwise.

const cases = [];
const counters = new Map();

function add(category, text) {
  const n = (counters.get(category) ?? 0) + 1;
  counters.set(category, n);
  cases.push({ id: `${category}-${String(n).padStart(3, "0")}`, text });
}

// ---------------------------------------------------------------- prose
add("prose", "Hello, world!");
add("prose", "The quick brown fox jumps over the lazy dog.");
add("prose", "I can't believe it's already Tuesday; we're behind schedule, aren't we?");
add("prose", "Tokenizers split text into pieces called tokens.");
add("prose", "OK");
add("prose", "Yes.");
add("prose", "Please summarize the following article in three bullet points.");
add("prose", "HELLO WORLD, THIS IS ALL CAPS AND QUITE LOUD!!!");
add("prose", "Mr. O'Neil's dog—a golden retriever—didn't bark; he'd learned not to.");
add("prose",
  "It was a bright cold day in April, and the clocks were striking thirteen. " +
  "Winston Smith, his chin nuzzled into his breast in an effort to escape the vile wind, " +
  "slipped quickly through the glass doors of Victory Mansions, though not quickly enough " +
  "to prevent a swirl of gritty dust from entering along with him.");
add("prose",
  "Large language models read text as a sequence of tokens rather than characters. " +
  "A token is often a common word, part of a longer word, a run of whitespace, or a " +
  "piece of punctuation. Because pricing and context limits are measured in tokens, " +
  "knowing the exact count of a prompt before sending it helps avoid truncation and " +
  "surprise bills.\n\nThis paragraph is followed by another one. It discusses how " +
  "different encodings produce different counts for the same input, and why a tool " +
  "that reports counts must name the encoding it used.");
add("prose",
  "In the beginning the Universe was created. This has made a lot of people very angry " +
  "and been widely regarded as a bad move. Many were increasingly of the opinion that " +
  "they'd all made a big mistake in coming down from the trees in the first place. And " +
  "some said that even the trees had been a bad move, and that no one should ever have " +
  "left the oceans.");
add("prose", "antidisestablishmentarianism pneumonoultramicroscopicsilicovolcanoconiosis supercalifragilisticexpialidocious");
add("prose", "e.g. i.e. etc. vs. a.m. p.m. U.S.A. Ph.D.");
add("prose", "well-known, state-of-the-art, up-to-date, mother-in-law's");
add("prose", "\"Quoted\" and 'single-quoted' and (parenthesized) and [bracketed] and {braced}.");
add("prose", "Wait... what?! No way!!! Really??? Hmm.");
add("prose", "Don't, won't, shouldn't've, y'all, 'tis, o'clock, rock 'n' roll.");
add("prose", "I'M SHOUTING. I'D SAY SO. THEY'RE HERE. WE'VE GONE. IT'S OK. YOU'LL SEE.");
add("prose", "camelCaseIdentifier PascalCaseName snake_case_name kebab-case-name SCREAMING_SNAKE");

// ---------------------------------------------------------------- code
add("code-java",
  "public class Hello {\n    public static void main(String[] args) {\n        System.out.println(\"Hello, world!\");\n    }\n}\n");
add("code-java",
  "import java.util.*;\n\npublic final class Counter {\n    private final Map<String, Integer> counts = new HashMap<>();\n\n" +
  "    /** Adds one occurrence of {@code key}. */\n    public void add(String key) {\n        counts.merge(key, 1, Integer::sum);\n    }\n\n" +
  "    @Override\n    public String toString() {\n        return \"Counter\" + counts;\n    }\n}\n");
add("code-java", "List<Map<String, ? extends Number>> xs = new ArrayList<>(); // generics >>> shifts");
add("code-java", "record Point(int x, int y) { Point { if (x < 0) throw new IllegalArgumentException(\"x<0\"); } }");
add("code-java", "\tif (a != null && a.length > 0) {\n\t\treturn a[0];\n\t}\n");
add("code-python",
  "def fib(n: int) -> int:\n    \"\"\"Return the n-th Fibonacci number.\"\"\"\n    a, b = 0, 1\n    for _ in range(n):\n        a, b = b, a + b\n    return a\n\n\nif __name__ == \"__main__\":\n    print(fib(30))\n");
add("code-python", "import numpy as np\nx = np.arange(10) ** 2\nprint(f\"{x.mean():.3f} ± {x.std():.3f}\")\n");
add("code-python", "class Foo:\n    def __init__(self, *args, **kwargs):\n        super().__init__()\n        self._cache: dict[str, list[int]] = {}\n");
add("code-python", "squares = [i*i for i in range(100) if i % 3 == 0]  # list comprehension");
add("code-python", "@dataclass(frozen=True)\nclass Config:\n    name: str = 'default'\n    retries: int = 3\n");
add("code-js", "const add = (a, b) => a + b;\nconsole.log(add(2, 3));\n");
add("code-js",
  "export async function fetchJson(url, { timeout = 5000 } = {}) {\n  const ctrl = new AbortController();\n  const t = setTimeout(() => ctrl.abort(), timeout);\n" +
  "  try {\n    const res = await fetch(url, { signal: ctrl.signal });\n    if (!res.ok) throw new Error(`HTTP ${res.status}`);\n    return await res.json();\n  } finally {\n    clearTimeout(t);\n  }\n}\n");
add("code-js", "x ??= y?.z ?? 0; a === b !== c; i++; --j; a **= 2; (() => {})();");
add("code-js", "document.querySelectorAll('div.item > span[data-id=\"42\"]').forEach(el => el.classList.toggle('active'));");
add("code-sql",
  "SELECT u.id, u.email, COUNT(o.id) AS order_count\nFROM users u\nLEFT JOIN orders o ON o.user_id = u.id\nWHERE u.created_at >= '2024-01-01'\nGROUP BY u.id, u.email\nHAVING COUNT(o.id) > 5\nORDER BY order_count DESC\nLIMIT 10;");
add("code-sql", "CREATE TABLE IF NOT EXISTS tokens (id BIGSERIAL PRIMARY KEY, text TEXT NOT NULL, count INT DEFAULT 0);");
add("code-sql", "insert into t(a,b) values (1,'x'),(2,'y'); update t set b=null where a=2; delete from t;");
add("code-shell", "#!/usr/bin/env bash\nset -euo pipefail\nfor f in *.txt; do\n  wc -l \"$f\"\ndone | sort -n | tail -5\n");
add("code-shell", "find . -type f -name '*.java' -print0 | xargs -0 grep -l 'TODO' 2>/dev/null || true");
add("code-shell", "export PATH=\"$HOME/.local/bin:$PATH\" && cd ~/proj && ./mvnw -q -DskipTests package");
add("code-shell", "awk -F, '{ s += $3 } END { printf \"%.2f\\n\", s/NR }' data.csv");
add("code-misc", "#include <stdio.h>\nint main(void) { printf(\"%d\\n\", 42); return 0; }\n");
add("code-misc", "fn main() { let v: Vec<u8> = (0..=255).collect(); println!(\"{:?}\", &v[..4]); }");
add("code-misc", "<div class=\"card\"><h1>Title</h1><p>Body &amp; more&nbsp;text</p></div>");
add("code-misc", "/^(?:[a-z0-9!#$%&'*+\\/=?^_`{|}~-]+)@(?:[a-z0-9-]+\\.)+[a-z]{2,}$/i");
add("code-misc", "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n<project><modelVersion>4.0.0</modelVersion></project>");

// ---------------------------------------------------------------- json
add("json", JSON.stringify({
  name: "tare", version: "0.1.0", encodings: ["o200k_base", "cl100k_base"],
  options: { strict: true, maxTokens: 4096, temperature: 0.7 }, tags: [], owner: null,
}, null, 2));
add("json", JSON.stringify({
  name: "tare", version: "0.1.0", encodings: ["o200k_base", "cl100k_base"],
  options: { strict: true, maxTokens: 4096, temperature: 0.7 }, tags: [], owner: null,
}));
add("json", JSON.stringify({
  model: "gpt-4o", messages: [
    { role: "system", content: "You are a helpful assistant." },
    { role: "user", content: "What's the capital of France?" },
    { role: "assistant", content: "The capital of France is Paris." },
  ],
}, null, 4));
add("json", JSON.stringify([{ id: 1, ok: true }, { id: 2, ok: false }, { id: 3, ok: null }]));
add("json", "{\"unicode\":\"caf\\u00e9 \\ud83d\\ude00\",\"escaped\":\"line1\\nline2\\ttab\",\"path\":\"C:\\\\Users\\\\me\"}");
add("json", JSON.stringify({ matrix: [[1, 2, 3], [4, 5, 6], [7, 8, 9]], pi: 3.14159265358979, e: 2.718281828, big: 12345678901234567 }, null, 2));
add("json", "{}");
add("json", "[]");
add("json", "{\"a\":{\"b\":{\"c\":{\"d\":{\"e\":{\"f\":[1,[2,[3,[4]]]]}}}}}}");

// ---------------------------------------------------------------- yaml
add("yaml",
  "apiVersion: apps/v1\nkind: Deployment\nmetadata:\n  name: tare\n  labels:\n    app: tare\nspec:\n  replicas: 3\n  template:\n    spec:\n" +
  "      containers:\n        - name: tare\n          image: tare:0.1.0\n          ports:\n            - containerPort: 8080\n");
add("yaml", "name: CI\non:\n  push:\n    branches: [main]\njobs:\n  build:\n    runs-on: ubuntu-latest\n    steps:\n      - uses: actions/checkout@v4\n      - run: mvn -B verify\n");
add("yaml", "---\ntitle: \"Release notes\"\ndate: 2024-05-01\ntags:\n  - cli\n  - tokens\ndescription: >\n  Folded text that\n  spans lines.\nliteral: |\n  keep\n    indentation\n...\n");
add("yaml", "anchors:\n  base: &base {timeout: 30, retries: 3}\n  prod:\n    <<: *base\n    timeout: 60\nempty: ~\nflag: yes\n");

// ---------------------------------------------------------------- markdown
add("markdown", "# Tare\n\nCount tokens in prompt templates.\n\n## Install\n\n```bash\nmvn package\n```\n");
add("markdown", "- item one\n- item two\n  - nested item\n    - deeper\n- item three\n\n1. first\n2. second\n10. tenth\n");
add("markdown", "| Encoding | Vocab | Notes |\n|---|---:|:---:|\n| o200k_base | 200k | newest |\n| cl100k_base | 100k | common |\n| p50k_base | 50k | older code |\n");
add("markdown", "Some **bold**, some *italic*, some `inline code`, a [link](https://example.com \"title\"), and ~~strike~~.");
add("markdown", "> A blockquote\n> spanning two lines.\n>\n> > Nested quote.\n\n---\n\n![alt text](img.png)\n");
add("markdown", "```java\nint x = 1;\n```\n\n```python\nx = 1\n```\n\n~~~\nplain fence\n~~~\n");
add("markdown", "- [ ] todo\n- [x] done\n\nTerm\n: Definition\n\nFootnote[^1].\n\n[^1]: The note.\n");
add("markdown", "###### h6\n##### h5\n#### h4\n### h3\n## h2\n# h1\nSetext\n======\nSub\n---\n");

// ---------------------------------------------------------------- whitespace
add("whitespace", "");
add("whitespace", " ");
add("whitespace", "  ");
add("whitespace", "   ");
add("whitespace", "    ");
add("whitespace", " ".repeat(8));
add("whitespace", " ".repeat(16));
add("whitespace", " ".repeat(33));
add("whitespace", " ".repeat(100));
add("whitespace", "\t");
add("whitespace", "\t\t");
add("whitespace", "\t".repeat(10));
add("whitespace", " \t \t\t  \t");
add("whitespace", "\n\n\n");
add("whitespace", " \n \n");
add("whitespace", "\n \n \n ");
add("whitespace", "   leading spaces");
add("whitespace", "trailing spaces   ");
add("whitespace", "   both sides   ");
add("whitespace", "\tleading tab");
add("whitespace", "trailing tab\t");
add("whitespace", "word     word\t\tword \t word");
add("whitespace", "a\n\nb\n\n\nc\n\n\n\nd");
add("whitespace", "line one\n    indented four\n        indented eight\n\tindented tab\n");
add("whitespace", "end with newline\n");
add("whitespace", "end with spaces and newline   \n");
add("whitespace", "\n\nstarts with two newlines");
add("whitespace", "x \n");
add("whitespace", "x  \n\n  y");
add("whitespace", "\r");
add("whitespace", "\f\v");
add("whitespace", "  \n\t\n  \t  \n");
add("whitespace", "a b  c   d    e     f      g       h");
for (let n = 1; n <= 40; n++) {
  add("newlines", "\n".repeat(n));
}

// ---------------------------------------------------------------- crlf
add("crlf", "first line\r\nsecond line\r\nthird line\r\n");
add("crlf", "\r\n");
add("crlf", "\r\n\r\n\r\n");
add("crlf", "Subject: Hello\r\nFrom: a@example.com\r\n\r\nBody text.\r\n");
add("crlf", "mixed\nendings\r\nhere\rand\n\rthere");
add("crlf", "public class A {\r\n    int x;\r\n}\r\n");

// ---------------------------------------------------------------- emoji
add("emoji", "😀");
add("emoji", "I love pizza 🍕🍕🍕 and tacos 🌮!");
add("emoji", "👨‍👩‍👧‍👦");
add("emoji", "👩🏽‍💻 wrote the code; 👨🏿‍🔬 checked it.");
add("emoji", "🇺🇸🇯🇵🇩🇪🇫🇷🇧🇷🇮🇳");
add("emoji", "👍👍🏻👍🏼👍🏽👍🏾👍🏿");
add("emoji", "🏳️‍🌈 🏴‍☠️ ❤️‍🔥 🧑‍🤝‍🧑");
add("emoji", "🏴\u{E0067}\u{E0062}\u{E0065}\u{E006E}\u{E0067}\u{E007F} England flag (tag sequence)");
add("emoji", "1️⃣ 2️⃣ #️⃣ *️⃣ ©️ ®️ ™️");
add("emoji", "☺ ☺️ ♥ ♥️ ✈ ✈️");
add("emoji", "🔥".repeat(50));
add("emoji", "Great job! 🎉🎊🥳 Let's celebrate 🍾🥂");

// ---------------------------------------------------------------- cjk
add("cjk-zh", "你好，世界！");
add("cjk-zh", "人工智能正在改变我们的生活方式，大型语言模型可以理解和生成自然语言文本。");
add("cjk-zh", "請問這個產品的價格是多少？我想購買三個。");
add("cjk-zh", "我今天用Java写了一个CLI工具，统计prompt里的token数量。");
add("cjk-ja", "こんにちは、世界！");
add("cjk-ja", "東京は日本の首都です。カタカナ、ひらがな、漢字を混ぜて書きます。");
add("cjk-ja", "ｶﾀｶﾅ（半角） と カタカナ（全角）、ＡＢＣ１２３（全角英数）。");
add("cjk-ko", "안녕하세요, 세계!");
add("cjk-ko", "대규모 언어 모델은 토큰 단위로 텍스트를 처리합니다. 한국어 문장도 예외는 아닙니다.");
add("cjk-ko", "한국어와 English가 섞인 문장입니다.");

// ---------------------------------------------------------------- latin accented
add("latin-fr", "Où est la bibliothèque ? À côté de l'église, près du café.");
add("latin-fr", "L'été dernier, nous avons mangé des crêpes à Besançon ; c'était délicieux !");
add("latin-fr", "« Bonjour », dit-il. Ça va ? Œuvre, cœur, naïve, Noël.");
add("latin-de", "Größe, Straße, Übermäßig, Äpfel und Öl.");
add("latin-de", "Donaudampfschifffahrtsgesellschaftskapitänsmütze ist ein langes Wort.");
add("latin-de", "„Guten Morgen“, sagte die Bäckerin, und reichte mir die Brötchen.");
add("latin-vi", "Tiếng Việt có nhiều dấu thanh: à á ả ã ạ ằ ắ ẳ ẵ ặ.");
add("latin-vi", "Xin chào, tôi tên là Nguyễn Văn Anh. Rất vui được gặp bạn!");
add("latin-pl", "Zażółć gęślą jaźń.");
add("latin-pl", "Pchnąć w tę łódź jeża lub ośm skrzyń fig.");
add("latin-misc", "Ñandú, año, señor, pingüino; São Paulo, coração; Ísland, þú, ðað; Dansk: æøå ÆØÅ.");
add("latin-misc", "cafe\u0301 (combining acute) vs café (precomposed)");
add("latin-misc", "Z\u0351\u0364\u036B\u0308a\u0310\u0342l\u035Bg\u0363o\u0306\u0344 text with stacked combining marks");
add("latin-misc", "İstanbul ıi İI — Turkish dotted and dotless i");

// ---------------------------------------------------------------- other scripts
add("cyrillic", "Привет, мир!");
add("cyrillic", "Съешь же ещё этих мягких французских булок, да выпей чаю.");
add("cyrillic", "Україна, Київ, їжак, ґанок; Беларусь: ўсё; Српски: ђ ј љ њ ћ џ.");
add("arabic", "مرحبا بالعالم");
add("arabic", "اللغة العربية تكتب من اليمين إلى اليسار، وتحتوي على ٢٨ حرفاً.");
add("arabic", "النص العربي مع English و 123 أرقام ١٢٣.");
add("hebrew", "שלום עולם");
add("hebrew", "עברית נכתבת מימין לשמאל. בְּרֵאשִׁית בָּרָא אֱלֹהִים");
add("devanagari", "नमस्ते दुनिया");
add("devanagari", "हिन्दी भारत की राजभाषा है। क्षत्रिय, ज्ञान, श्री।");
add("devanagari", "संस्कृतम् जगतः एकतमा अतिप्राचीना भाषा अस्ति।");
add("thai", "สวัสดีชาวโลก");
add("thai", "ภาษาไทยไม่มีการเว้นวรรคระหว่างคำ ทำให้การตัดคำเป็นเรื่องยาก");
add("script-misc", "Γειά σου Κόσμε! Ελληνικά: αβγδεζηθικλμνξοπρστυφχψω.");
add("script-misc", "Բարեւ աշխարհ; გამარჯობა მსოფლიო; ሰላም ልዑል");
add("script-misc", "தமிழ் வணக்கம்; বাংলা নমস্কার; ગુજરાતી નમસ્તે; ਪੰਜਾਬੀ ਸਤ ਸ੍ਰੀ ਅਕਾਲ");
add("script-misc", "𝐁𝐨𝐥𝐝 𝑰𝒕𝒂𝒍𝒊𝒄 𝔉𝔯𝔞𝔨𝔱𝔲𝔯 𝟙𝟚𝟛 (mathematical alphanumerics)");
add("script-misc", "𠀀𠀁𪚥 (CJK extension B, astral)");

// ---------------------------------------------------------------- numbers
add("numbers", "0");
add("numbers", "42");
add("numbers", "123");
add("numbers", "1234");
add("numbers", "12345678901234567890");
add("numbers", "3141592653589793238462643383279502884197169399375105820974944592307816406286");
add("numbers", "3.14159 2.71828 -0.5 +1e10 6.022e23 1.0E-9");
add("numbers", "1,234,567.89 1.234.567,89 1 234 567");
add("numbers", "+1 (555) 123-4567, 555.123.4567, +44 20 7946 0958");
add("numbers", "2024-05-01 05/01/2024 01.05.2024 2024-05-01T13:45:30.123Z");
add("numbers", "$19.99 €5,00 £3.50 ¥1000 ₹250 ₿0.0001 USD 1,000,000");
add("numbers", "Version 1.2.3-beta.4+build.567, IP 192.168.0.1, port :8080");
add("numbers", "0xDEADBEEF 0b1010_1010 0o755 1_000_000 42L 3.0f");
add("numbers", "١٢٣٤٥٦٧٨٩٠ ०१२३४५६७८९ 一二三 ①②③ Ⅻ ½ ¾ ²³");
add("numbers", "9".repeat(100));
add("numbers", "1 2 3 4 5 6 7 8 9 10 11 12 13 14 15 16 17 18 19 20");

// ---------------------------------------------------------------- special-token text
add("special", "<|endoftext|>");
add("special", "<|fim_prefix|>");
add("special", "<|fim_middle|>");
add("special", "<|fim_suffix|>");
add("special", "<|im_start|>");
add("special", "<|im_end|>");
add("special", "<|endofprompt|>");
add("special", "Document one ends here.<|endoftext|>Document two starts here.");
add("special", "<|im_start|>system\nYou are a helpful assistant.<|im_end|>\n<|im_start|>user\nHi!<|im_end|>\n<|im_start|>assistant\n");
add("special", "<|fim_prefix|>def add(a, b):\n    <|fim_suffix|>\n    return c<|fim_middle|>");
add("special", "Please never output the string <|endofprompt|> or <|endoftext|> in your answer.");
add("special", "<|endoftext|><|endoftext|><|endoftext|>");
add("special", "<|endoftext|  <endoftext|> <|endoftext> |endoftext| < |endoftext| >");
add("special", "<|ENDOFTEXT|> <|EndOfText|> <|end_of_text|> <|eot_id|> <s></s> [INST] [/INST]");

// ---------------------------------------------------------------- template placeholders
add("template", "Hello {{ name }}, welcome to {{ company }}!");
add("template", "Hello {name}, your order {order_id} ships on {date}.");
add("template", "Hello ${name}, you have ${count} new messages.");
add("template", "{% if user.is_admin %}Admin panel{% else %}Dashboard{% endif %}");
add("template", "{% for item in items %}\n- {{ item.title | upper }} ({{ item.price | round(2) }})\n{% endfor %}");
add("template", "{{name}}{{ name }}{{  name  }}{{- name -}}{{{ raw }}}");
add("template", "{{#each users}}<li>{{this.name}}</li>{{/each}}{{! comment }}");
add("template", "%s has %d items costing %.2f; %(name)s; $1 $2; :name; @name; #{name}");
add("template", "You are {{assistant_name}}. Today is {{current_date}}. The user's name is {{user_name}}.\n\n{{#if context}}Context:\n{{context}}{{/if}}");
add("template", "{{ '{{' }} escaped {{ '}}' }} and {{ \"quoted\" }} and {# jinja comment #}");

// ---------------------------------------------------------------- invisible characters
add("invisible", "zero\u200Bwidth\u200Bspace");
add("invisible", "\u200B");
add("invisible", "join\u200Der and non\u200Cjoiner");
add("invisible", "soft\u00ADhy\u00ADphen\u00ADated");
add("invisible", "no-break\u00A0space and 100\u00A0km");
add("invisible", "\uFEFFBOM at the start");
add("invisible", "BOM\uFEFFin the\uFEFFmiddle");
add("invisible", "\u00A0\u00A0\u00A0");
add("invisible", "thin\u2009space, hair\u200Aspace, em\u2003space, ideographic\u3000space, narrow\u202Fnbsp");
add("invisible", "left\u200Eto\u200Fright marks and \u202Aembedding\u202C and \u2066isolate\u2069");
add("invisible", "word\u2060joiner and\u2028line separator and\u2029paragraph separator");
add("invisible", "control\u0001chars\u0007bell\u001Bescape\u007Fdel\u0085nel");
add("invisible", "null\u0000byte");
add("invisible", "variation\uFE0Fselector\uFE0E and private use \uE000\uF8FF");

// ---------------------------------------------------------------- typography / symbols
add("symbols", "“Curly double quotes” and ‘curly single quotes’ and it’s");
add("symbols", "Wait for it… and… then… done…");
add("symbols", "→ ← ↑ ↓ ↔ ⇒ ⇐ ⇔ ➜ ⟶ ↩");
add("symbols", "✓ ✔ ✗ ✘ ☑ ☐ ☒ ✅ ❌");
add("symbols", "┌──────┬──────┐\n│ name │ size │\n├──────┼──────┤\n│ a    │ 1    │\n└──────┴──────┘");
add("symbols", "═══╗\n║ ║\n╚══╝ ░▒▓█ ▀▄ ■□▪▫");
add("symbols", "— – - ‐ ‑ ‒ ― (dashes) • · ‣ ◦ (bullets) § ¶ † ‡ ‰ ′ ″");
add("symbols", "∀x ∈ ℝ: x² ≥ 0; ∑ᵢ aᵢ ≤ ∞; ∫₀¹ f(x) dx ≈ π; ¬(p ∧ q) ≡ ¬p ∨ ¬q");
add("symbols", "© ® ™ ℠ № ℃ ℉ µ Ω Å ℮");
add("symbols", "!@#$%^&*()_+-=[]{}\\|;':\",./<>?`~");
add("symbols", "♠♣♥♦ ♩♪♫♬ ☀☁☂☃ ★☆ ☯ ☮ ⚠ ⚡");

// ---------------------------------------------------------------- urls / emails
add("url", "https://www.example.com/path/to/page?query=token&lang=en#section-2");
add("url", "Visit http://localhost:8080/api/v1/users/42 or ftp://files.example.org/pub/README.");
add("url", "https://example.com/search?q=%E4%BD%A0%E5%A5%BD&utm_source=newsletter&utm_medium=email");
add("url", "git@github.com:owner/repo.git and ssh://user@host:2222/srv/repo");
add("url", "file:///C:/Users/me/Documents/report%20final.pdf and /home/me/.config/tare/config.yaml");
add("email", "Contact us at support@example.com or sales+eu@example.co.uk.");
add("email", "first.last@sub.domain.example, o'brien@example.ie, \"quoted name\"@example.com");
add("email", "From: Jane Doe <jane.doe@example.com>\nTo: team@example.org\nSubject: Re: tokens");

// ---------------------------------------------------------------- long repeated runs
add("long", "a".repeat(5000));
add("long", "ab ".repeat(2000));
add("long", "=".repeat(300));
add("long", "-".repeat(80));
add("long", "*".repeat(1000));
add("long", "The quick brown fox jumps over the lazy dog. ".repeat(60));
add("long", "0123456789".repeat(200));
add("long", "🙂".repeat(500));
add("long", "日本語".repeat(700));
add("long", " ".repeat(3000));
add("long", "\n".repeat(500));
add("long", "ab".repeat(1500));
add("long", ".".repeat(257));
add("long", "\t ".repeat(600));

// ---------------------------------------------------------------- prompts
add("prompt",
  "You are Ava, a friendly and professional customer support assistant for Acme Cloud Storage.\n\n" +
  "## Your goals\n" +
  "1. Resolve the customer's issue in as few messages as possible.\n" +
  "2. Be polite, concise, and accurate. Never invent policies or prices.\n" +
  "3. If you cannot help, offer to escalate to a human agent.\n\n" +
  "## Rules\n" +
  "- Do not ask for full passwords or full credit card numbers.\n" +
  "- You may ask for the last 4 digits of the card on file to verify identity.\n" +
  "- Refunds over $100 require escalation.\n" +
  "- Always answer in the customer's language.\n\n" +
  "## Context\n" +
  "Customer name: {{customer_name}}\n" +
  "Plan: {{plan}} (renews {{renewal_date}})\n" +
  "Open tickets: {{open_ticket_count}}\n\n" +
  "Respond in plain text without Markdown headings.");
add("prompt",
  "Classify the sentiment of each review as Positive, Negative, or Neutral.\n\n" +
  "Review: \"The battery lasts all day and the screen is gorgeous.\"\nSentiment: Positive\n\n" +
  "Review: \"It stopped working after two weeks and support never replied.\"\nSentiment: Negative\n\n" +
  "Review: \"It arrived on Tuesday. The box was blue.\"\nSentiment: Neutral\n\n" +
  "Review: \"Honestly? Best purchase I've made this year!!! 😍\"\nSentiment: Positive\n\n" +
  "Review: \"{{review_text}}\"\nSentiment:");
add("prompt",
  "Tool: get_weather\n" +
  "Description: Returns the current weather for a city. Use this whenever the user asks about " +
  "temperature, rain, wind, or whether they need an umbrella.\n" +
  "Parameters (JSON Schema):\n" +
  JSON.stringify({
    type: "object",
    properties: {
      city: { type: "string", description: "City name, e.g. \"San Francisco, CA\"" },
      unit: { type: "string", enum: ["celsius", "fahrenheit"], default: "celsius" },
    },
    required: ["city"],
    additionalProperties: false,
  }, null, 2));
add("prompt", JSON.stringify({
  type: "function",
  function: {
    name: "search_orders",
    description: "Search a customer's orders by status and date range.",
    parameters: {
      type: "object",
      properties: {
        status: { type: "string", enum: ["pending", "shipped", "delivered", "cancelled"] },
        from: { type: "string", format: "date" },
        to: { type: "string", format: "date" },
        limit: { type: "integer", minimum: 1, maximum: 100 },
      },
      required: ["status"],
    },
  },
}));
add("prompt",
  "Extract the following fields from the email below and return them as JSON with keys " +
  "\"name\", \"company\", \"phone\", and \"request\". If a field is missing use null.\n\n" +
  "---\nHi there,\n\nThis is Priya Raman from Northwind Traders. Could someone call me back at " +
  "+1 415-555-0199 about upgrading our plan?\n\nThanks,\nPriya\n---");
add("prompt",
  "<|im_start|>system\nYou are a terse assistant. Answer in one sentence.<|im_end|>\n" +
  "<|im_start|>user\nWhy is the sky blue?<|im_end|>\n<|im_start|>assistant\n");
add("prompt",
  "### Instruction:\nTranslate the text into French, German, and Japanese.\n\n### Input:\n" +
  "The meeting has been moved to Thursday at 3 p.m.\n\n### Response:\n");
add("prompt",
  "You are a senior Java reviewer. Review the diff below and list problems as bullet points, " +
  "most severe first. For each, cite the line and suggest a fix.\n\n```diff\n" +
  "--- a/Counter.java\n+++ b/Counter.java\n@@ -10,7 +10,7 @@\n-    return count;\n+    return count++;\n```\n");

// ---------------------------------------------------------------- mixed
add("mixed", "Hello 你好 こんにちは 안녕하세요 Привет مرحبا שלום नमस्ते สวัสดี 👋");
add("mixed", "Price: €12,50 (≈ $13.60) — 20% off! ✅ Order #A-1029 → ships 2024-06-03 📦");
add("mixed", "日本語 and English mixed: 東京タワーはTokyo Towerです。Height: 333m.");
add("mixed", "const greeting = \"¡Hola, señor! 👋\"; // 注释 comment комментарий");
add("mixed", "Ünïcödé ßtrîñg wïth émöjï 🎈 and numbers 12345 and symbols ©®™");

// ---------------------------------------------------------------- pseudo-random
// mulberry32: tiny deterministic 32-bit PRNG (public domain algorithm).
function mulberry32(seed) {
  let a = seed >>> 0;
  return function () {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

// Each pool is a list of whole code points / grapheme pieces (never half a
// surrogate pair), so any concatenation is well-formed Unicode.
const pools = [
  [..."abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ"],
  [..."0123456789"],
  [" ", " ", " ", "  ", "\t", "\n", "\n\n", "\r\n", " \n"],
  [..."!\"#$%&'()*+,-./:;<=>?@[\\]^_`{|}~"],
  [..."àáâãäåæçèéêëìíîïñòóôõöøùúûüýÿßœłśźżąęćńğışțđươ"],
  [..."абвгдеёжзийклмнопрстуфхцчшщъыьэюяАБВГДЕЖЗИЙКЛМНОП"],
  [..."你好世界中文字符人工智能语言模型東京日本語こんにちはカタカナ안녕하세요한국어"],
  [..."مرحباعالمשלוםעולםनमस्तेदुनियाสวัสดีชาวโลก"],
  ["😀", "🍕", "🚀", "❤️", "👍🏽", "👨‍👩‍👧", "🇯🇵", "🏳️‍🌈", "✨", "🔥", "🙂", "🧑‍💻"],
  ["\u200B", "\u200D", "\u00AD", "\u00A0", "\uFEFF", "\u2009", "\u0301", "\u3000"],
  [..."“”‘’…→←✓✗─│┌┐└┘═║•·—–€£¥₹©®™"],
  ["<|endoftext|>", "<|fim_prefix|>", "<|im_start|>", "<|endofprompt|>", "{{ name }}", "{name}", "${name}", "{% if x %}"],
  [" the", " and", " of", " to", " token", " count", "ing", "tion", "'s", "'re", " I", " a"],
];

function randomString(rand, length) {
  let s = "";
  for (let i = 0; i < length; i++) {
    const pool = pools[Math.floor(rand() * pools.length)];
    s += pool[Math.floor(rand() * pool.length)];
  }
  return s;
}

{
  const rand = mulberry32(0x7a7e2024);
  const lengths = [1, 2, 3, 5, 8, 13, 21, 34, 55, 89, 144, 233, 377];
  for (let i = 0; i < 40; i++) {
    const len = i < lengths.length ? lengths[i] : 1 + Math.floor(rand() * 400);
    add("random", randomString(rand, len));
  }
  // A few single-class random runs, to stress one pre-tokenizer branch at a time.
  for (let p = 0; p < pools.length; p++) {
    const r = mulberry32(1000 + p);
    let s = "";
    for (let i = 0; i < 60; i++) s += pools[p][Math.floor(r() * pools[p].length)];
    add("random-class", s);
  }
}

// ---------------------------------------------------------------- tools
// Each tool definition of the demo's JSON tool file, minified by JSON.stringify: Tare's own
// minification must give the same text, and its count the same tokens.
{
  const toolFile = new URL("../../corpora/demo/tools/customer-service.tools.json", import.meta.url);
  for (const tool of JSON.parse(readFileSync(toolFile, "utf8"))) add("tools", JSON.stringify(tool));
}

export { cases };
export const strings = cases.map((c) => c.text);
export default cases;
