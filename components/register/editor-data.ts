import type { ComponentProps } from 'react';
import type { AnodeGroupForm, AssetForm, RemoveGroupForm } from './lazy-forms';

/*
 * The data of the asset page's closed editors (EditorDisclosure, asset-editors.tsx), built on the server: a module
 * of its own, without 'use client', so the page can call editorData.
 */

/** The asset page's closed editors and the props each form takes. */
export interface EditorProps {
  asset: ComponentProps<typeof AssetForm>;
  'record-group': ComponentProps<typeof AnodeGroupForm>;
  'edit-group': ComponentProps<typeof AnodeGroupForm>;
  'close-group': ComponentProps<typeof RemoveGroupForm>;
}
export type EditorKind = keyof EditorProps;

/** An editor's props as the page hands them over: one JSON string (editorData). */
export type EditorData<K extends EditorKind> = string & { readonly editor: K };

/**
 * An editor's props as one JSON string, for EditorDisclosure. The asset page's closed editors carry the choices of
 * their forms (the catalogue, the zones, every fitted group): as one string each, the server writes them into the
 * page once, instead of encoding every value for the page's payload and decoding it again for its HTML (measured,
 * npm run bench). Parsed in the browser when the editor is opened.
 */
export function editorData<K extends EditorKind>(_kind: K, props: EditorProps[K]): EditorData<K> {
  return JSON.stringify(props) as EditorData<K>;
}

