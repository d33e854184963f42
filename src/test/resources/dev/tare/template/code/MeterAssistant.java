package example;

/** The meter-reading assistant of the Riverton city water utility (invented example data). */
public class MeterAssistant {
    // tare: prompt budget=600
    // tare: var customer=12 meter="RW-4417"
    static final String SYSTEM_PROMPT = """
        You are the meter-reading assistant of Riverton Water.
          Readings are in cubic metres.  \s
        Ask for the meter number, \
        then for the reading.
        """;

    static final String ESCAPED_INSTRUCTIONS = "Say \"thanks\",\tthen stop.\nOctal \101\60\0 and caf\u00e9 and \\u0041 stay.";

    static final String PERSONA_PROMPT = \u0022You are calm and exact, and you never round a meter reading.\u0022;

    static final String USER_PROMPT_HEADER = "Customer " + "asks about " + "their latest meter reading.";

    static final char QUOTE = '"';

    static String userPrompt(String customer, String meter, int days) {
        String userPrompt = "Customer " + customer + " asks about meter " + meter + " read " + days + " days ago.";
        String reminderPrompt = String.format("Remind %s that meter %2$s is read every %3$d days; %<d is the usual.%n",
                customer, meter, days);
        String followUpPrompt = "Ask %s whether the reading of %s looks right (100%% sure?).".formatted(customer, meter);
        if (meter.isEmpty()) {
            throw new IllegalArgumentException("The meter number is missing from the reading request");
        }
        return userPrompt + reminderPrompt + followUpPrompt;
    }
}
