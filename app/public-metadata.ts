import type { Metadata } from 'next';

/**
 * What the public pages (the front page, sign-in, sign-up, reset) add to the root layout's metadata: the social
 * card a link preview shows. A link to a signed-in page is answered with the sign-in page, which carries it.
 */
export const PUBLIC_METADATA: Metadata = {
  openGraph: {
    title: 'Tidewarden',
    description: 'Sacrificial anodes for hulls and jetties: design, register, surveys and docking lists.',
    images: [{ url: '/og-image.png', width: 1200, height: 630, alt: 'Tidewarden: an anode block above a rising tide' }],
  },
};
