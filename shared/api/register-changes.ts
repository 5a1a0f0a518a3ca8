/** The registers whose edits are logged (issue 13 finding 7). */
export const REGISTERS = ['station', 'instrument', 'chart_form', 'ink_line'] as const;
export type Register = (typeof REGISTERS)[number];

/** create and edit of a register record; hand_in_again: a reworked ink line handed in once more, its earlier result replaced. */
export const REGISTER_CHANGE_ACTIONS = ['create', 'edit', 'hand_in_again'] as const;
export type RegisterChangeAction = (typeof REGISTER_CHANGE_ACTIONS)[number];

/** One entry of a register's change log: who changed what, when, with each field's before and after value (the scan change log's shape). */
export interface RegisterChangeLogEntry {
  id: string;
  /** ISO 8601 UTC. */
  at: string;
  personName: string;
  action: RegisterChangeAction;
  changes: Record<string, { before: unknown; after: unknown }>;
}
