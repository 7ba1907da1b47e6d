'use client';

import { useEffect } from 'react';
import { loadViewer, viewerCopyCookie } from './shared-copy-viewer';

/**
 * Signed in without a scribeline-copy cookie (signed in before it existed, or it was cleared): ask once, and
 * the answer sets it, so the next published page read is the copy that suits this member. Renders nothing.
 */
export function ViewerCopyCheck() {
  useEffect(() => {
    if (!viewerCopyCookie()) void loadViewer(true);
  }, []);
  return null;
}
