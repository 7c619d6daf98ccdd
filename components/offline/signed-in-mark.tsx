'use client';
import { useEffect } from 'react';
import { markSignedIn } from '@/lib/offline/sign-out';

/**
 * Tells this phone's service worker who is signed in, on every page that knows (the organisation pages, the list
 * of organisations) and on the sign-in page (nobody). Whenever the member differs from the one named before,
 * the worker stops serving and sending the earlier member's pages and queue, and the earlier member's cached
 * pages are deleted.
 */
export function SignedInMark({ userId }: { userId: string | null }) {
  useEffect(() => {
    void markSignedIn(userId);
  }, [userId]);
  return null;
}
