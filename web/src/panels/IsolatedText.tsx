import { Fragment } from 'react';
import { useEditorState } from '../editor/useEditor';
import { BIDI_CONTROL, isolateSegments, sharedHazards } from './bidi';

/** A message that quotes user text (labels, ids): hazardous parts shown in <bdi>, the rest as plain text. */
export function IsolatedText({ text }: { text: string }) {
  const hazards = useEditorState((s) => sharedHazards(s.doc));
  if (hazards.length === 0 && !BIDI_CONTROL.test(text)) return <>{text}</>;
  return (
    <>
      {isolateSegments(text, hazards).map((s, i) =>
        s.isolate ? (
          <bdi key={i} data-testid="isolated-text">
            {s.text}
          </bdi>
        ) : (
          <Fragment key={i}>{s.text}</Fragment>
        ),
      )}
    </>
  );
}
