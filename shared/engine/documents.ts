/**
 * The plan document alone: its zod schema and types, for code that reads, stores or lists plan files without
 * running the engine (plan pages, the plan repository, the JSON Schema writer). Everything else: index.ts.
 */
export * from './document/plan.schema';
