"""The billing assistant of the Riverton city water utility (invented example data)."""
import inspect
import logging
import textwrap

logger = logging.getLogger(__name__)

# tare: prompt budget=900 target=hosted calls_per_day=4000
SYSTEM_PROMPT = """You are the billing assistant of Riverton Water.
Answer questions about bills, meter readings and payment plans.\tBe brief and polite.
"""

GREETING_TEMPLATE = ("Hello {customer}, thanks for contacting Riverton Water "  # the opening
                     'about account {account}. '
                     r"Bills live under C:\billing\new until they are sent.")

PERSONA = textwrap.dedent("""
    You speak like a patient clerk at the counter.
      You never guess a meter reading.
    You say when a question is outside billing.
    """).strip()

ESCALATION_INSTRUCTIONS = inspect.cleandoc("""
        Escalate to a person when the customer mentions a leak,
        a shut-off notice or a payment older than 90 days.
            Give them the hotline number 555-0147.
    """)

FEW_SHOT_EXAMPLES = [
    "Q: Why is my bill higher this month?\nA: Your reading rose from 41 to 58 cubic metres.",
    "Q: Can I pay in parts?\nA: Yes, a payment plan splits the bill into three monthly parts.",
]

ESCAPES_PROMPT = "Quote \"bills\" and \\ paths, tab\there, caf\xe9 \u00e9\N{BLACK STAR} \101 \
and a continued line."

PROMPT_LOG_FORMAT = "%(asctime)s %(levelname)s prompt=%(name)s: %(message)s"
PROMPT_QUERY = "SELECT body FROM prompts WHERE name = ?"
SYSTEM_PROMPT_FILE = "prompts/billing/system.md"


def ask(client, question, account, plan):
    # SYSTEM_PROMPT = "a commented-out prompt is never read"
    messages = [
        {"role": "system", "content": SYSTEM_PROMPT},
        {"role": "user", "content": f"Account {account!r:>10}: {question} (plan {plan['name']}, {{draft}})"},
    ]
    logger.info("Asking about account %s with %d messages", account, len(messages))
    if not question:
        raise ValueError(f"The question for account {account} is empty; ask the customer again")
    reminder = "Remind the customer that plan {0} renews on {date} each year.".format(plan, date=plan["renews"])
    summary_prompt = "Summarize the call about account %s in %d lines for the billing team." % (account, 3)
    return client.chat(system=SYSTEM_PROMPT, messages=messages, extra=reminder + summary_prompt)
