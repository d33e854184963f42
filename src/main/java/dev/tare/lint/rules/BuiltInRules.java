package dev.tare.lint.rules;

import dev.tare.lint.Rule;
import java.util.List;

/** The rules compiled into Tare, one class each in this package. */
public final class BuiltInRules {
    private BuiltInRules() {
    }

    /** A fresh instance of every built-in rule. */
    public static List<Rule> all() {
        return List.of(new BaselineGrowth(), new BaselineShrink(), new BlankLines(), new CacheOrder(), new CostlyCharacter(), new DecorativeRuler(),
                new InvisibleCharacter(), new NearDuplicateInstruction(), new OverBudget(), new PrettyJson(), new PrettyJsonBlock(),
                new ProseTab(), new RepeatedInstruction(), new SharedBlock(), new SpaceRun(), new TrailingWhitespace(),
                new UnknownSuppression(), new UnresolvedInclude(), new UnsizedVariable(), new UnterminatedPlaceholder(),
                new UnusedVariable(), new PrettyToolFile(), new RepeatedToolDescription(), new LongToolText(),
                new UndescribedToolParameter(), new ToolCost(), new ContextLimit());
    }
}
