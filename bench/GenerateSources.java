import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;

/**
 * Writes invented application source files that hold no prompt, for bench/code.sh: Python,
 * TypeScript, Java and Go modules in equal numbers, each with the string literals such code is full
 * of (log lines, SQL, URLs, paths, error messages, format strings, short keys) and none of them a
 * prompt by name, key, call or comment. Every other file also uses words that prompts are named by
 * (an error payload's message, a response's content), so that it is read literal by literal.
 *
 *   java bench/GenerateSources.java OUT [COUNT] [SEED]     (default 10000 files, seed 20261206)
 */
public final class GenerateSources {
    private static final String[] NOUNS = {"booking", "sailing", "vessel", "harbour", "ticket", "cabin", "route",
            "passenger", "fare", "timetable", "berth", "crossing", "invoice", "refund", "voucher", "deck"};
    private static final String[] VERBS = {"load", "save", "find", "update", "cancel", "price", "check", "list",
            "merge", "close", "open", "sync"};

    private GenerateSources() {
    }

    public static void main(String[] args) throws IOException {
        if (args.length < 1 || args.length > 3) {
            System.err.println("usage: java bench/GenerateSources.java OUT [COUNT] [SEED]");
            System.exit(2);
        }
        Path out = Path.of(args[0]);
        int count = args.length > 1 ? Integer.parseInt(args[1]) : 10_000;
        Random random = new Random(args.length > 2 ? Long.parseLong(args[2]) : 20261206L);
        long bytes = 0;
        for (int i = 0; i < count; i++) {
            String noun = NOUNS[random.nextInt(NOUNS.length)];
            String folder = "src/" + NOUNS[i % NOUNS.length] + "/" + (i / 400);
            Path file;
            String text;
            switch (i % 4) {
                case 0 -> {
                    file = out.resolve(folder + "/" + noun + "_" + i + ".py");
                    text = python(random, noun, i % 8 < 4);
                }
                case 1 -> {
                    file = out.resolve(folder + "/" + noun + i + ".ts");
                    text = typescript(random, noun, i % 8 < 4);
                }
                case 2 -> {
                    file = out.resolve(folder + "/" + capital(noun) + i + ".java");
                    text = java(random, noun, capital(noun) + i, i % 8 < 4);
                }
                default -> {
                    file = out.resolve(folder + "/" + noun + i + ".go");
                    text = go(random, noun, i % 8 < 4);
                }
            }
            Files.createDirectories(file.getParent());
            Files.writeString(file, text);
            bytes += text.length();
        }
        System.err.printf(Locale.ROOT, "wrote %d source files without prompts, %d bytes, to %s%n", count, bytes, out);
    }

    private static String verb(Random random) {
        return VERBS[random.nextInt(VERBS.length)];
    }

    private static String capital(String word) {
        return Character.toUpperCase(word.charAt(0)) + word.substring(1);
    }

    private static String python(Random random, String noun, boolean wordy) {
        StringBuilder out = new StringBuilder("\"\"\"Storage and lookups for " + noun + " records.\"\"\"\n\n"
                + "import logging\nimport os\nfrom dataclasses import dataclass\n\n"
                + "log = logging.getLogger(__name__)\n"
                + "TABLE = \"" + noun + "s\"\n"
                + "QUERY = \"SELECT id, status, updated_at FROM " + noun + "s WHERE id = %s\"\n"
                + "API_URL = \"https://api.example.com/v2/" + noun + "s\"\n"
                + "DATA_DIR = os.path.join(\"var\", \"data\", \"" + noun + "\")\n\n"
                + "@dataclass\nclass " + capital(noun) + ":\n    id: str\n    status: str = \"open\"\n\n");
        for (int f = 0; f < 8 + random.nextInt(6); f++) {
            String verb = verb(random);
            out.append("def ").append(verb).append('_').append(noun).append("_").append(f).append("(db, key, retries=3):\n")
                    .append("    # ").append(verb).append(" one ").append(noun).append(", retrying on a timeout\n")
                    .append("    log.info(\"").append(verb).append(" %s attempt %d\", key, retries)\n")
                    .append("    row = db.execute(QUERY, (key,)).fetchone()\n")
                    .append("    if row is None:\n")
                    .append("        raise KeyError(f\"no ").append(noun).append(" with id {key}\")\n")
                    .append("    result = {\"id\": row[0], \"status\": row[1], \"path\": f\"{DATA_DIR}/{key}.json\"}\n")
                    .append("    log.debug(\"%s done in %.2f ms\", key, 1.5)\n")
                    .append(wordy ? "    body = response.content.decode(\"utf-8\")\n"
                            + "    error = {\"message\": \"not found\", \"status\": 404}\n" : "")
                    .append("    return result\n\n");
        }
        return out.toString();
    }

    private static String typescript(Random random, String noun, boolean wordy) {
        StringBuilder out = new StringBuilder("import { Client } from \"./client\";\n\n"
                + "const BASE_URL = \"https://api.example.com/v2/" + noun + "s\";\n"
                + "const STORAGE_KEY = \"" + noun + ":last\";\n\n"
                + "export interface " + capital(noun) + " {\n  id: string;\n  status: \"open\" | \"closed\";\n}\n\n");
        for (int f = 0; f < 8 + random.nextInt(6); f++) {
            String verb = verb(random);
            out.append("export async function ").append(verb).append(capital(noun)).append(f)
                    .append("(client: Client, id: string): Promise<").append(capital(noun)).append("> {\n")
                    .append("  // ").append(verb).append(" the ").append(noun).append(" and cache it\n")
                    .append("  const response = await client.get(`${BASE_URL}/${id}?expand=status`);\n")
                    .append("  if (!response.ok) {\n")
                    .append("    throw new Error(`").append(noun).append(" ${id} failed with ${response.status}`);\n")
                    .append("  }\n")
                    .append("  console.debug(\"").append(verb).append(" ok\", id);\n")
                    .append(wordy ? "  const content = await response.text();\n  const message = `status ${response.status}`;\n" : "")
                    .append("  localStorage.setItem(STORAGE_KEY, id);\n")
                    .append("  return { id, status: \"open\" };\n}\n\n");
        }
        return out.toString();
    }

    private static String java(Random random, String noun, String type, boolean wordy) {
        StringBuilder out = new StringBuilder("package app." + noun + ";\n\n"
                + "import java.util.logging.Logger;\n\n"
                + "/** Reads and writes " + noun + " rows. */\n"
                + "final class " + type + " {\n"
                + "    private static final Logger LOG = Logger.getLogger(\"" + noun + "\");\n"
                + "    private static final String SELECT = \"SELECT id, status FROM " + noun + "s WHERE id = ?\";\n"
                + "    private static final String ENDPOINT = \"https://api.example.com/v2/" + noun + "s\";\n\n");
        for (int f = 0; f < 8 + random.nextInt(6); f++) {
            String verb = verb(random);
            out.append("    String ").append(verb).append(f).append("(String id, int attempt) {\n")
                    .append("        // ").append(verb).append(" one ").append(noun).append('\n')
                    .append("        LOG.info(String.format(\"").append(verb).append(" %s (attempt %d)\", id, attempt));\n")
                    .append("        if (id.isEmpty()) {\n")
                    .append("            throw new IllegalArgumentException(\"empty ").append(noun).append(" id\");\n")
                    .append(wordy ? "        }\n        if (attempt > 3) {\n            LOG.warning(\"giving up: \" + new RuntimeException(\"x\").getMessage());\n" : "")
                    .append("        }\n")
                    .append("        return ENDPOINT + \"/\" + id + \"?fields=status\";\n")
                    .append("    }\n\n");
        }
        return out.append("}\n").toString();
    }

    private static String go(Random random, String noun, boolean wordy) {
        StringBuilder out = new StringBuilder("package " + noun + "\n\n"
                + "import (\n\t\"fmt\"\n\t\"log\"\n)\n\n"
                + "const selectRow = `SELECT id, status FROM " + noun + "s WHERE id = $1`\n"
                + "const endpoint = \"https://api.example.com/v2/" + noun + "s\"\n\n");
        for (int f = 0; f < 8 + random.nextInt(6); f++) {
            String verb = verb(random);
            out.append("// ").append(capital(verb)).append(f).append(" handles one ").append(noun).append(".\n")
                    .append("func ").append(capital(verb)).append(f).append("(id string, attempt int) (string, error) {\n")
                    .append("\tlog.Printf(\"").append(verb).append(" %s attempt %d\", id, attempt)\n")
                    .append("\tif id == \"\" {\n")
                    .append("\t\treturn \"\", fmt.Errorf(\"empty ").append(noun).append(" id: %w\", errMissing)\n")
                    .append("\t}\n")
                    .append(wordy ? "\tmsg := fmt.Sprintf(\"%s failed\", id)\n\t_ = msg\n" : "")
                    .append("\treturn fmt.Sprintf(\"%s/%s?fields=status\", endpoint, id), nil\n}\n\n");
        }
        return out.toString();
    }
}
