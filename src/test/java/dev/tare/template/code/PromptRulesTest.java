package dev.tare.template.code;

import static dev.tare.template.code.CodeSamples.find;
import static dev.tare.template.code.CodeSamples.named;
import static dev.tare.template.code.CodeSamples.names;
import static dev.tare.template.code.CodeSamples.only;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.template.ContentOrigin;
import dev.tare.template.Message;
import dev.tare.template.Segment;
import dev.tare.template.TemplateMeta;
import dev.tare.template.VariableSpec;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/**
 * Which literals are prompts: by the name they are assigned to, the key or keyword they are the value
 * of, the configured call they are passed to, or a {@code tare:} comment; and which are not, even
 * where their place says prompt: log and error messages, SQL, single words, URLs and paths, format
 * specifiers alone, and short labels.
 */
class PromptRulesTest {
    private static final String LONG = "You are the assistant of Riverton Water and you answer briefly.";

    private static CodePrompts python(String source, String... calls) {
        return find(Language.PYTHON, source, calls);
    }

    @Test
    void namesSayPromptInEveryCase() {
        String source = """
                system_prompt = "%1$s"
                systemPrompt = "%1$s"
                SYSTEM_PROMPT = "%1$s"
                fewShotExamples = "%1$s"
                FEW_SHOT = "%1$s"
                billing_persona = "%1$s"
                preamble = "%1$s"
                SAFETY_GUIDELINES = "%1$s"
                outage_instructions = "%1$s"
                self.welcome_message = "%1$s"
                config.template = "%1$s"
                greeting = "%1$s"
                fewer_shots = "%1$s"
                systematic = "%1$s"
                """.formatted(LONG);
        assertEquals(List.of("system_prompt", "systemPrompt", "SYSTEM_PROMPT", "fewShotExamples", "FEW_SHOT",
                "billing_persona", "preamble", "SAFETY_GUIDELINES", "outage_instructions", "welcome_message", "template"),
                names(python(source)));
    }

    @Test
    void namesForSomethingElseAreNotPromptsThoughTheyHavePromptWords() {
        String source = """
                ERROR_MESSAGE = "%1$s"
                system_prompt_path = "%1$s"
                PROMPT_LOGGER_NAME = "%1$s"
                template_id = "%1$s"
                PROMPT_CONFIG = {"owner": "%1$s"}
                """.formatted(LONG);
        assertEquals(List.of(), names(python(source)));
    }

    @Test
    void keysAndKeywordArgumentsSayPrompt() {
        String source = """
                messages = [
                    {"role": "system", "content": "%1$s"},
                    dict(role="assistant", content="%1$s"),
                ]
                reply = client.complete(prompt="%1$s", instructions="%1$s", model="riverton-small-model-2")
                options = {"systemPrompt": "%1$s", "label": "%1$s", "message": "%1$s"}
                """.formatted(LONG);
        CodePrompts found = python(source);
        assertEquals(List.of("messages.content", "content", "prompt", "instructions", "options.systemPrompt"),
                names(found));
        assertEquals(Optional.of("system"), found.prompts().get(0).role());
        assertEquals(Optional.of("assistant"), found.prompts().get(1).role());
        assertEquals(Optional.of("system"), named(found, "instructions").role());
    }

    @Test
    void listsAndMappingsUnderAPromptNameHoldPrompts() {
        String source = """
                PROMPTS = {
                    "billing": "%1$s",
                    "outage": {"text": "%1$s"},
                }
                FEW_SHOT_EXAMPLES = ["%1$s", "%1$s"]
                settings = ["%1$s"]
                prompts["leak"] = "%1$s"
                """.formatted(LONG);
        assertEquals(List.of("PROMPTS.billing", "PROMPTS.outage.text", "FEW_SHOT_EXAMPLES", "FEW_SHOT_EXAMPLES",
                "prompts.leak"), names(python(source)));
    }

    @Test
    void configuredCallsTakePromptsMatchingTheEndOfTheCallName() {
        String source = """
                self.assistant.ask("%1$s")
                assistant.ask(question, "%1$s")
                ask("%1$s")
                PromptBuilder.from_text("%1$s", version="2024-riverton-release-7")
                """.formatted(LONG);
        CodePrompts found = python(source, "assistant.ask", "PromptBuilder.from_text");
        assertEquals(List.of("self.assistant.ask", "assistant.ask", "PromptBuilder.from_text"), names(found));
    }

    @Test
    void callsNamedForPromptsTakeThemButASystemCallIsAShellCommand() {
        String source = """
                class Assistant {
                    @SystemText("%1$s")
                    String chat(String question);
                    void build() {
                        var messages = List.of(new SystemMsg("%1$s"), UserTurnMessage.of("%1$s"));
                        builder.systemPrompt("%1$s").setInstructions("%1$s");
                        Runtime.system("%1$s");
                        notify.sendMessage("%1$s");
                    }
                }
                """.formatted(LONG);
        CodePrompts found = find(Language.JAVA, source);
        assertEquals(List.of("SystemText", "SystemMsg", "UserTurnMessage.of", "builder.systemPrompt",
                "builder.systemPrompt.setInstructions"), names(found));
        assertEquals(Optional.of("system"), found.prompts().get(0).role());
        assertEquals(Optional.of("user"), found.prompts().get(2).role());
    }

    @Test
    void mapPairsReadTheirKeys() {
        String source = """
                class Assistant {
                    Map<String, String> message = Map.of("role", "system", "content", "%1$s");
                    Map<String, String> other = Map.of("label", "%1$s");
                }
                """.formatted(LONG);
        CodePrompt prompt = only(find(Language.JAVA, source));
        assertEquals("message.content", prompt.name());
        assertEquals(Optional.of("system"), prompt.role());
    }

    @Test
    void aTarCommentMarksOrExcludesInTheLanguagesCommentSyntax() {
        String python = """
                # tare: prompt
                greeting = "Hi"

                # tare: ignore
                SYSTEM_PROMPT = "%1$s"
                """.formatted(LONG);
        CodePrompt marked = only(python(python));
        assertEquals("greeting", marked.name());
        assertEquals("Hi", marked.value());
        String script = """
                /* tare: prompt */
                notify(`Welcome back, ${name}`);
                // tare: ignore
                const SYSTEM_PROMPT = "%1$s";
                """.formatted(LONG);
        assertEquals("notify", only(find(Language.JAVASCRIPT, script)).name());
        String go = """
                package assistant

                // The greeting shown first.
                // tare: prompt name=welcome role=assistant
                var greeting = fmt.Sprintf("Hi %%s", name)
                """;
        CodePrompt welcome = only(find(Language.GO, go));
        assertEquals("welcome", welcome.name());
        assertEquals(Optional.of("assistant"), welcome.role());
    }

    @Test
    void aMarkOnTheLineAboveTheStatementCoversALiteralOnALaterLine() {
        String source = """
                # tare: prompt
                note = (
                    "Hi"
                )
                """;
        assertEquals("note", only(python(source)).name());
    }

    @Test
    void settingsAreParsedAsFrontMatterWouldGiveThem() {
        String source = """
                # tare: prompt budget=800 target=hosted calls_per_day=5000 output_tokens=250 tools=tools/a.yaml,tools/b.json
                # tare: var question=40 account="A-1042 north" plan
                # tare: owner=billing-team
                USER_PROMPT = f"Question about {account}: {question}"
                """;
        CodePrompts found = python(source);
        CodePrompt prompt = only(found);
        TemplateMeta meta = prompt.meta();
        assertEquals(Optional.of("hosted"), meta.target());
        assertEquals(OptionalInt.of(800), meta.budget());
        assertEquals(OptionalInt.of(250), meta.outputTokens());
        assertEquals(OptionalDouble.of(5000), meta.callsPerDay());
        assertEquals(List.of("tools/a.yaml", "tools/b.json"), meta.tools());
        assertEquals(Map.of("question", new VariableSpec(OptionalInt.of(40), Optional.empty()),
                "account", new VariableSpec(OptionalInt.empty(), Optional.of("A-1042 north"))), meta.variables());
        assertEquals("billing-team", prompt.settings().get("owner"));
        assertEquals(List.of("line 2: tare: does not know 'plan'; write prompt, ignore, var NAME=SIZE or KEY=VALUE"),
                found.problems());
    }

    @Test
    void badSettingsAndStrayCommentsAreProblemsNamingTheirLines() {
        String source = """
                # tare: prompt budget=lots calls_per_day=-3 var.x
                SYSTEM_PROMPT = "%1$s"

                # tare: prompt
                def build():
                    pass

                # tare: budget=300
                label = "%1$s"
                """.formatted(LONG);
        CodePrompts found = python(source);
        assertEquals(OptionalInt.empty(), only(found).meta().budget());
        assertEquals(List.of(
                "line 1: tare: budget must be a whole number of tokens above zero (got lots)",
                "line 1: tare: calls_per_day must be a number of calls a day, zero or more (got -3)",
                "line 1: tare: does not know 'var.x'; write prompt, ignore, var NAME=SIZE or KEY=VALUE",
                "line 9: the tare: settings above this string literal apply to nothing, since Tare does not take it"
                        + " for a prompt; add 'prompt' to the comment to measure it",
                "line 4: this tare: comment stands above no string literal; put it on the line just above the"
                        + " literal or the name it is assigned to"), found.problems());
    }

    @Test
    void logAndErrorMessagesAreNotPromptsEvenInPromptPlaces() {
        String python = """
                logger.info("System prompt for %s has %d tokens and was sent", name, count)
                raise PromptError(f"The system prompt for {name} has no instructions at all")
                SYSTEM_PROMPT_FORMAT = "%(asctime)s %(levelname)s %(name)s: %(message)s"
                """;
        assertEquals(List.of(), names(python(python, "logger.info")));
        String java = """
                class Assistant {
                    void check() {
                        throw new IllegalStateException(String.format("System prompt %s has no instructions left", name));
                    }
                }
                """;
        assertEquals(List.of(), names(find(Language.JAVA, java)));
        String go = """
                package assistant

                func check() error {
                	promptProblem := fmt.Errorf("the system prompt for %s could not be built today", name)
                	log.Printf("system prompt for %s built with %d tokens", name, n)
                	return promptProblem
                }
                """;
        assertEquals(List.of(), names(find(Language.GO, go, "log.Printf")));
        String script = "console.log(`System prompt for ${name} sent with ${n} tokens to the model`);\n";
        assertEquals(List.of(), names(find(Language.JAVASCRIPT, script, "console.log")));
    }

    @Test
    void sqlUrlsPathsSpecifiersAndShortLabelsAreNotPrompts() {
        String source = """
                messages = [
                    {"content": "SELECT body FROM prompts WHERE name = ? AND version = 3"},
                    {"content": "select * from meters where account = $1 order by read_at"},
                    {"content": "https://riverton.example/help/prompts?topic=billing&lang=en"},
                    {"content": f"{base_url}/prompts/{name}/system.md"},
                    {"content": "%s: %s (%d)"},
                    {"content": "{} - {}"},
                    {"content": f"{first} {last}"},
                    {"content": "You are"},
                    {"content": "system"},
                    {"content": "Select the best answer from the list of meter readings below."},
                    {"content": f"Question: {question}"},
                ]
                """;
        assertEquals(List.of("Select the best answer from the list of meter readings below.", "Question: {question}"),
                python(source).prompts().stream().map(CodePrompt::value).toList());
    }

    @Test
    void segmentsCoverTheValueWithVariablesWhereTheyStand() {
        String source = "USER_PROMPT = f\"Account {account}: {question}\"\n";
        CodePrompt prompt = only(python(source));
        List<Segment> segments = prompt.segments(source);
        assertEquals(4, segments.size());
        assertEquals(new Segment.Text("Account ", new dev.tare.template.Span(0, 8, 1, 17)), segments.get(0));
        Segment.Variable account = (Segment.Variable) segments.get(1);
        assertEquals("account", account.name());
        assertEquals("{account}", account.source());
        assertEquals(new dev.tare.template.Span(8, 17, 1, 25), account.span());
        assertEquals(": ", ((Segment.Text) segments.get(2)).text());
        int end = segments.get(segments.size() - 1).span().end();
        assertEquals(prompt.value().length(), end);
        assertTrue(segments.stream().allMatch(s -> s.span().end() <= prompt.value().length()));
        Message message = prompt.message(source, "message");
        assertEquals(new Message("user", prompt.value(), segments,
                new ContentOrigin.Literal("message", 1, prompt.column(), prompt.map(), prompt.meta())), message);
    }
}
