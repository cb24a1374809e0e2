/**
 * Version of the calculation rules, frozen into every revision. Raise it whenever a change can alter a
 * number the engine prints (a formula, a factor, a catalogue row), so an issued package says which
 * rules produced it.
 */
export const ENGINE_VERSION = '1.1.0';
