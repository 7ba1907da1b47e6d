'use client';

import { ButtonLink } from '@/components/ui/button';
import { useSharedCopyViewer } from './shared-copy-viewer';

/** The home page's first button on the copy cached for everyone: create an account, or, signed in, start a project. */
export function SharedFirstStep() {
  const viewer = useSharedCopyViewer();
  return viewer ? <ButtonLink href="/projects/new">Start a project</ButtonLink> : <ButtonLink href="/sign-up">Create an account</ButtonLink>;
}
