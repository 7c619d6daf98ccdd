'use client';
import dynamic from 'next/dynamic';

/*
 * The register's edit forms as the pages use them: each sits in a closed Disclosure, which renders it only once
 * opened, so its code (the fields, the position reader, the schemas' constants and zod with them) is loaded then,
 * not with the page. Part of the pages' first-load JavaScript otherwise (npm run bench). A form that is open from
 * the start (the fleet page's first run) is still rendered on the server.
 */
export const AssetForm = dynamic(() => import('./asset-form').then((m) => m.AssetForm));
export const ZoneForm = dynamic(() => import('./zone-form').then((m) => m.ZoneForm));
export const AnodeGroupForm = dynamic(() => import('./anode-group-form').then((m) => m.AnodeGroupForm));
export const RemoveGroupForm = dynamic(() => import('./anode-group-form').then((m) => m.RemoveGroupForm));
