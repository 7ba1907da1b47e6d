// Plain shapes the data layer returns and components render.
import type { LengthUnit } from './units';
import type { Visibility } from './visibility';

export type ProjectView = {
  id: number;
  slug: string;
  title: string;
  summary: string;
  units: LengthUnit;
  visibility: Visibility;
  version: number;
  publishedAt: string | null;
  createdAt: string;
  updatedAt: string;
  owner: { id: number; name: string; handle: string };
  mentors: { id: number; name: string }[];
  /** Open (unresolved) risk flags, filled in only for lists the builder or a mentor reads. */
  openFlags?: number;
  /** What the viewer may do, from the policy, so the UI can hide the rest. */
  can: {
    update: boolean;
    delete: boolean;
    manageMentors: boolean;
    editLog: boolean;
    publish: boolean;
    follow: boolean;
    hideComment: boolean;
    flagRisk: boolean;
    answerFlag: boolean;
  };
};
