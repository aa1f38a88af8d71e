import { describe, expect, it } from 'vitest';
import { mentionNote, mentionNoteText } from '../../../src/lib/reviews/mention-notes';

const members = [
  { id: 'u1', name: 'Sam Reyes', email: 'sam@crew.test' },
  { id: 'u2', name: 'Alex Moor', email: 'alex@crew.test' },
];

describe('the line under a comment', () => {
  it('names who was told, and each @name that matched nobody', () => {
    const note = mentionNote('@sam and @zed, look at the heel', ['u1'], members);
    expect(note).toEqual({ told: ['Sam Reyes'], unmatched: ['zed'] });
    expect(mentionNoteText(note)).toBe('Told: Sam Reyes. @zed matched nobody in the team, so nobody was told of it.');
  });

  it('says nothing when the comment mentions nobody', () => {
    expect(mentionNoteText(mentionNote('Pattern looks fine.', [], members))).toBeNull();
  });

  it('counts a mention by e-mail or first name as matched', () => {
    expect(mentionNote('@alex@crew.test @Alex', ['u2'], members).unmatched).toEqual([]);
  });
});
