// Reviews as the server hands them to pages and the API's clients: plain shapes, no database.

import type { PartView } from '../register/views';
import type { DECISIONS } from './schemas';

/** A review without its snapshot and comments. */
export interface ReviewView {
  id: string;
  gearSetId: string;
  status: 'open' | 'decided';
  openedBy: string;
  openedAt: string;
  decision: (typeof DECISIONS)[number] | null;
  decisionLabel: string | null;
  reason: string | null;
  notes: string | null;
  reinspectAfterRuns: number | null;
  reinspectAtRuns: number | null;
  runsAtDecision: number | null;
  decidedBy: string | null;
  decidedAt: string | null;
}

/** A photo of the evidence, as the snapshot kept it. */
export interface SnapshotPhoto {
  id: string;
  side: string;
  url: string;
  thumbnailUrl: string;
}

/** A review with its evidence (in the reader's units) and its comments, oldest first. */
export interface ReviewDetail extends ReviewView {
  snapshot: { takenAt: string; gearSet: PartView; photos: SnapshotPhoto[]; analysis: unknown };
  comments: {
    id: string;
    body: string;
    authorId: string;
    authorName: string;
    mentions: string[];
    createdAt: string;
    /** "Told: Sam." and any @name that matched nobody, or null when the comment mentions no one. */
    mentionNote: string | null;
  }[];
}

/** The review page: the review and the reasons a retirement may give. */
export interface ReviewPageView {
  review: ReviewDetail;
  retirementReasons: string[];
}
