'use client';
import type { ComponentProps } from 'react';
import { Disclosure } from '@/components/ui/disclosure';
import { AnodeGroupForm, AssetForm, RemoveGroupForm } from './lazy-forms';

/** The asset page's closed editors and the props each form takes. */
interface EditorProps {
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

function Editor<K extends EditorKind>({ kind, data }: { kind: K; data: EditorData<K> }) {
  const props = JSON.parse(data) as EditorProps[K];
  switch (kind) {
    case 'asset':
      return <AssetForm {...(props as EditorProps['asset'])} />;
    case 'record-group':
    case 'edit-group':
      return <AnodeGroupForm {...(props as EditorProps['record-group'])} />;
    default:
      return <RemoveGroupForm {...(props as EditorProps['close-group'])} />;
  }
}

/** A closed editor of the asset page (a Disclosure): its form is loaded, and its data read, when it is first opened. */
export function EditorDisclosure<K extends EditorKind>({ summary, kind, data, className }: { summary: string; kind: K; data: EditorData<K>; className?: string }) {
  return (
    <Disclosure className={className} summary={summary}>
      <div className="mt-3">
        <Editor kind={kind} data={data} />
      </div>
    </Disclosure>
  );
}
