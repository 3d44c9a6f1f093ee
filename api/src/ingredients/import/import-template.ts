import { StreamableFile } from '@nestjs/common';
import { IMPORT_COLUMNS, IMPORT_RULES } from '@crumbproof/shared';
import ExcelJS from 'exceljs';

const XLSX_MIME = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

/** The header row of the template: every column the import reads, named as the import names it. */
export const TEMPLATE_HEADERS: string[] = IMPORT_COLUMNS.map((c) => c.header);

/** RFC 4180 quoting, for a header that would ever hold a comma, a quote or a line break. */
const csvCell = (text: string) => (/[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);

/** The CSV template: the header row alone, with a UTF-8 byte order mark so spreadsheets open it as UTF-8. */
export function templateCsv(): StreamableFile {
  const text = `\uFEFF${TEMPLATE_HEADERS.map(csvCell).join(',')}\r\n`;
  return new StreamableFile(Buffer.from(text, 'utf8'), {
    type: 'text/csv; charset=utf-8',
    disposition: 'attachment; filename="crumbproof-ingredients-template.csv"',
  });
}

/**
 * The workbook template: a first sheet "Ingredients" with the header row (the sheet the import
 * reads), and a second sheet "Columns" saying what each column means and how the file is read.
 */
export async function templateXlsx(): Promise<StreamableFile> {
  const wb = new ExcelJS.Workbook();
  const sheet = wb.addWorksheet('Ingredients', { views: [{ state: 'frozen', ySplit: 1 }] });
  sheet.addRow(TEMPLATE_HEADERS).font = { bold: true };
  sheet.columns.forEach((column, i) => {
    column.width = Math.max(12, TEMPLATE_HEADERS[i].length + 2);
  });
  const help = wb.addWorksheet('Columns');
  help.addRow(['Column', 'Required', 'Meaning']).font = { bold: true };
  for (const c of IMPORT_COLUMNS) help.addRow([c.header, c.required ? 'yes' : 'no', c.description]);
  help.addRow([]);
  help.addRow(['How the file is read']).font = { bold: true };
  for (const rule of IMPORT_RULES) help.addRow([rule]);
  help.getColumn(1).width = 18;
  help.getColumn(2).width = 10;
  help.getColumn(3).width = 100;
  const bytes = Buffer.from(await wb.xlsx.writeBuffer());
  return new StreamableFile(bytes, {
    type: XLSX_MIME,
    disposition: 'attachment; filename="crumbproof-ingredients-template.xlsx"',
  });
}
