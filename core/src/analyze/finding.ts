import type { Finding } from './types';

/** A finding as a stage writes it; its id is made from rule, subject and message. */
export type NewFinding = Omit<Finding, 'id' | 'related' | 'fixes' | 'data'> & Partial<Pick<Finding, 'related' | 'fixes' | 'data'>>;

/** Fills in the stable id (`${ruleId}:${subject}:${messageId}`) and the empty lists. */
export function finding(f: NewFinding): Finding {
  const subject = f.subject.kind === 'project' ? 'project' : f.subject.id;
  return { id: `${f.ruleId}:${subject}:${f.messageId}`, related: [], fixes: [], data: {}, ...f };
}
