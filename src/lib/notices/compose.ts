/**
 * The words of every notice Lashline sends: a plain-text body with the facts, a link to the record,
 * and the unsubscribe link. Pure, so tests read exactly what people receive.
 */
export const NOTICE_KIND_LABELS = {
  'review-opened': 'A review is opened',
  'decision-made': 'A decision is made',
  mention: 'Someone mentions me',
  'near-limit': 'A gear set nears its life limit',
  'life-reached': 'A gear set reaches its life limit',
  'reinspect-due': 'A re-inspection falls due',
} as const;

export type NoticeKind = keyof typeof NOTICE_KIND_LABELS;

export interface NoticeContent {
  kind: NoticeKind;
  teamName: string;
  subject: string;
  /** The facts, one per line, e.g. "Gear set: GS-4102 (4.10:1)". */
  facts: string[];
  link: string;
}

/** The subject and body of one notice to one person. */
export function composeNotice(content: NoticeContent, unsubscribeLink: string): { subject: string; text: string } {
  return {
    subject: `[${content.teamName}] ${content.subject}`,
    text: [
      content.subject,
      '',
      ...content.facts,
      '',
      `Open it in Lashline: ${content.link}`,
      '',
      '—',
      `You get this because "${NOTICE_KIND_LABELS[content.kind]}" is on for you in ${content.teamName}.`,
      `Stop these notices (no sign-in needed): ${unsubscribeLink}`,
    ].join('\n'),
  };
}

/**
 * The names mentioned in a comment: "@ines", "@ines.calloway@lashline.test".
 * @example findMentions('Ask @tech and @Teodor') // ['tech', 'teodor']
 */
export function findMentions(body: string): string[] {
  const found = new Set<string>();
  for (const match of body.matchAll(/(?:^|[\s(])@([\p{L}\p{N}._+-]+(?:@[\p{L}\p{N}.-]+)?)/gu))
    found.add(match[1]!.toLowerCase().replace(/[.]+$/, ''));
  return [...found];
}

/** Whether a mention names this member: their whole e-mail, its local part, or their first name. */
export function mentionMatches(mention: string, member: { email: string; name: string }): boolean {
  const email = member.email.toLowerCase();
  const first = member.name.trim().split(/\s+/)[0]?.toLowerCase() ?? '';
  return mention === email || mention === email.split('@')[0] || (first.length > 1 && mention === first);
}
