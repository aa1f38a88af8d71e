import { findMentions, mentionMatches } from '../notices/compose';

/**
 * What a comment's mentions came to, for the line under it: who was told (the members it named, by the
 * ids stored with it) and each @name that matched nobody in the team, which would otherwise pass in silence.
 * @example mentionNote('@sam @zed look', ['u1'], members) // { told: ['Sam Reyes'], unmatched: ['zed'] }
 */
export function mentionNote(
  body: string,
  toldIds: readonly string[],
  members: readonly { id: string; name: string; email: string }[],
): { told: string[]; unmatched: string[] } {
  const names = new Map(members.map((m) => [m.id, m.name]));
  const told = toldIds.map((id) => names.get(id) ?? 'a former member');
  const unmatched = findMentions(body).filter((mention) => !members.some((m) => mentionMatches(mention, m)));
  return { told, unmatched };
}

/** The line itself, or null when the comment mentions nobody. */
export function mentionNoteText(note: { told: string[]; unmatched: string[] }): string | null {
  const parts: string[] = [];
  if (note.told.length) parts.push(`Told: ${note.told.join(', ')}.`);
  if (note.unmatched.length)
    parts.push(
      `${note.unmatched.map((m) => `@${m}`).join(', ')} matched nobody in the team, so nobody was told of ${note.unmatched.length === 1 ? 'it' : 'them'}.`,
    );
  return parts.length ? parts.join(' ') : null;
}
