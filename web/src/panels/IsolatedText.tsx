import { Fragment, useMemo } from 'react';
import { useEditorState } from '../editor/useEditor';
import { BIDI_CONTROL, bidiHazards, isolateSegments } from './bidi';

/** A message that quotes user text (labels, ids): hazardous parts shown in <bdi>, the rest as plain text. */
export function IsolatedText({ text }: { text: string }) {
  const doc = useEditorState((s) => s.doc);
  const hazards = useMemo(() => bidiHazards(doc), [doc]);
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
