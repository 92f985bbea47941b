import { LIGHT, M, type Sheet } from './sheet';

export interface TableColumn<T> {
  head: string;
  width: number;
  cell: (row: T) => string;
  bold?: (row: T) => boolean;
}

export function table<T>(sh: Sheet, columns: TableColumn<T>[], rows: readonly T[], fontSize = 7.5): void {
  const lineH = fontSize * 1.22;
  const header = () => {
    sh.fill(LIGHT);
    sh.doc.rect(M, sh.y, sh.w - 2 * M, lineH + 5, 'F');
    sh.font(fontSize, 'bold');
    let x = M + 3;
    for (const col of columns) {
      sh.text(col.head, x, sh.y + lineH);
      x += col.width;
    }
    sh.y += lineH + 7;
  };
  header();
  rows.forEach((row, i) => {
    // Measure in the font the cell is drawn in, or the wrap width is wrong.
    const cells = columns.map((col) => {
      sh.font(fontSize, col.bold?.(row) ? 'bold' : 'normal');
      return sh.split(col.cell(row), col.width - 6);
    });
    const h = Math.max(...cells.map((c) => c.length)) * lineH + 4;
    if (sh.y + h > sh.bodyBottom) {
      sh.newPage();
      header();
    }
    if (i % 2 === 1) {
      sh.fill([247, 247, 247]);
      sh.doc.rect(M, sh.y - 1, sh.w - 2 * M, h, 'F');
    }
    let x = M + 3;
    columns.forEach((col, k) => {
      sh.font(fontSize, col.bold?.(row) ? 'bold' : 'normal');
      sh.text(cells[k]!, x, sh.y + fontSize);
      x += col.width;
    });
    sh.y += h;
  });
  sh.y += 8;
}
