/** Shown in the editor, the CLI and every report. Linewright never gives a verdict of acceptance. */
export const CAUTION =
  'Linewright assists a qualified person; it does not approve anything. Results depend on the code edition ' +
  'and local amendments in force, and on field conditions the drawing does not show. The authority having ' +
  'jurisdiction and licensed practice decide.';

export const CAUTION_SHORT = 'Assists a qualified person. The AHJ and licensed practice decide.';
