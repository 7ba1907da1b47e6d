'use client';

import type { ReactNode } from 'react';
import { useQuery } from '@tanstack/react-query';
import { getJson } from '@/lib/client/api-client';
import { QueryIsland } from '@/components/providers';
import type { MediaView, NoteView } from '@/lib/types/log';
import type { CommentView } from '@/lib/types/comments';
import { ClipWorkbench } from './clip-workbench';

const byPosition = (a: MediaView, b: MediaView) => a.position - b.position || a.id - b.id;

type Props = {
  entryId: number;
  initialMedia: MediaView[];
  notes: NoteView[];
  noteMarkers?: Record<number, ReactNode>;
  readerQuestions?: CommentView[];
  questionThreadBase: string;
};

/**
 * The builder's clips with their notes, on the edit page right under the uploads. It reads the same
 * list as the uploads manager (the two islands share the browser's one query client), so a clip appears
 * here, playable and ready for notes, as soon as its upload is accepted: no reload.
 */
export function EntryClipSections(props: Props) {
  return (
    <QueryIsland>
      <ClipSections {...props} />
    </QueryIsland>
  );
}

function ClipSections({
  entryId,
  initialMedia,
  notes,
  noteMarkers,
  readerQuestions,
  questionThreadBase,
}: Props) {
  const { data: media = initialMedia } = useQuery({
    queryKey: ['media', entryId],
    queryFn: async () => (await getJson<{ media: MediaView[] }>(`/api/entries/${entryId}/media`)).media,
    initialData: initialMedia,
  });
  const clips = media.filter((m) => m.kind === 'clip').sort(byPosition);
  if (!clips.length) return null;
  return (
    <>
      {clips.map((clip) => (
        <section key={clip.id} aria-label={`Notes on ${clip.caption || clip.name}`} className="space-y-2">
          <h2 className="text-xl font-bold">Notes on “{clip.caption || clip.name}”</h2>
          <ClipWorkbench
            clip={clip}
            notes={notes.filter((n) => n.mediaId === clip.id)}
            canEdit
            noteMarkers={noteMarkers}
            readerQuestions={readerQuestions}
            questionThreadBase={questionThreadBase}
          />
        </section>
      ))}
    </>
  );
}
