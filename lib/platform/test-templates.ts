// Names of the template databases that npm test prepares once per run; test files clone them
// through tests/support/database.ts.
export const TEMPLATE_DATABASES = {
  migrated: "shuntbook_tpl_migrated",
  seeded: "shuntbook_tpl_seeded",
} as const;

export type Template = keyof typeof TEMPLATE_DATABASES;
