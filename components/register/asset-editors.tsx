'use client';
import { Disclosure } from '@/components/ui/disclosure';
import { AnodeGroupForm, AssetForm, RemoveGroupForm } from './lazy-forms';
import type { EditorData, EditorKind, EditorProps } from './editor-data';

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
