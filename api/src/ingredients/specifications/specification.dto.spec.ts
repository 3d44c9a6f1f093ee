import { specificationFieldsSchema, today } from './specification.dto';
import { contentDisposition } from './specifications.service';
import { describeType, safeFilename } from '../../common/multipart-upload';

describe('specification uploads', () => {
  const days = (n: number) => {
    const d = new Date();
    d.setDate(d.getDate() + n);
    return today(d);
  };
  const messages = (fields: unknown) => {
    const r = specificationFieldsSchema.safeParse(fields);
    return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  };

  it('writes today as the local calendar date', () => {
    expect(today(new Date(2027, 0, 5, 23, 59))).toBe('2027-01-05');
  });

  it('accepts a review date of today or later, with an optional note', () => {
    expect(messages({ reviewBy: days(0) })).toEqual([]);
    expect(messages({ reviewBy: ` ${days(400)} `, note: 'Annual check' })).toEqual([]);
  });

  it('takes no review date, or an empty one, as one year from the upload (worked out when it is saved)', () => {
    expect(messages({})).toEqual([]);
    expect(messages({ reviewBy: '' })).toEqual([]);
  });

  it('refuses a malformed, impossible or past review date, naming it', () => {
    expect(messages({ reviewBy: 20301231 })).toEqual([
      'reviewBy: Give the date by which the kitchen must check this specification again as YYYY-MM-DD, or leave it out for one year from today.',
    ]);
    expect(messages({ reviewBy: '01/02/2030' })).toEqual(["reviewBy: '01/02/2030' is not a date written as YYYY-MM-DD."]);
    expect(messages({ reviewBy: '2030-13-01' })).toEqual(['reviewBy: 2030-13-01 is not a real date.']);
    expect(messages({ reviewBy: days(-1) })).toEqual([
      `reviewBy: ${days(-1)} has already passed; give today (${today()}) or a later date.`,
    ]);
    expect(messages({ reviewBy: days(1), note: 'x'.repeat(501) })).toEqual(['note: Keep the note to 500 characters.']);
  });

  it('keeps only a safe file name', () => {
    expect(safeFilename('C:\\Users\\chef\\Desktop\\spec.pdf')).toBe('spec.pdf');
    expect(safeFilename('../../etc/a\u0000b<c>|d?.pdf')).toBe('abcd.pdf');
    expect(safeFilename('...hidden.png')).toBe('hidden.png');
    expect(safeFilename(undefined)).toBe('');
    const long = safeFilename(`${'a'.repeat(300)}.pdf`);
    expect(long).toHaveLength(200);
    expect(long.endsWith('.pdf')).toBe(true);
  });

  it('names a type plainly', () => {
    expect(describeType(undefined)).toBe('not a recognised type');
    expect(describeType({ ext: 'gif', mime: 'image/gif' })).toBe('a GIF file (image/gif)');
    expect(describeType({ ext: 'xlsx', mime: 'application/x' })).toBe('an XLSX file (application/x)');
  });

  it('serves a name with an ASCII fallback and the exact UTF-8 name', () => {
    expect(contentDisposition('Crème "fraîche".pdf')).toBe(
      `attachment; filename="Cr_me _fra_che_.pdf"; filename*=UTF-8''Cr%C3%A8me%20%22fra%C3%AEche%22.pdf`,
    );
  });
});
