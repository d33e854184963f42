package dev.tare.lint;

/**
 * A rule about tool files. Tool files are JSON or YAML definitions, not prose, so only rules of this
 * kind run on them, and these run on nothing else.
 */
public interface ToolRule extends Rule {
}
