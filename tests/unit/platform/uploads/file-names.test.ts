import { describe, expect, test } from 'vitest';
import { attachmentDisposition, safeFileName } from '../../../../src/lib/platform/uploads/file-names';

describe('stored file names', () => {
  test.each([
    ['a plain name keeps its base and extension', 'Rail schematic rev B.pdf', ['pdf'], 'Rail schematic rev B.pdf'],
    ['a Unix path is dropped', '../../etc/passwd.pdf', ['pdf'], 'passwd.pdf'],
    ['a Windows path and drive are dropped', 'C:\\Users\\ana\\Desktop\\board.pdf', ['pdf'], 'board.pdf'],
    ['a drive without a folder is dropped', 'C:board.pdf', ['pdf'], 'board.pdf'],
    ['control characters go, runs of spaces shrink', 'line\u0000one\r\n  two\t.pdf', ['pdf'], 'lineone two.pdf'],
    ['a bidi override cannot disguise the extension', 'invoice\u202Efdp.exe', ['pdf'], 'invoicefdp.pdf'],
    ['reserved characters become underscores', 'a<b>c:d"e|f?g*h.pdf', ['pdf'], 'a_b_c_d_e_f_g_h.pdf'],
    ['an extension that does not match the contents is replaced', 'setup.exe', ['pdf'], 'setup.pdf'],
    ['a matching alias is kept, lower-cased', 'IMG_0042.JPEG', ['jpg', 'jpeg'], 'IMG_0042.jpeg'],
    ['a number after a dot is part of the name', 'notes v1.2', ['txt', 'csv'], 'notes v1.2.txt'],
    ['leading dots cannot make a hidden file', '...profile.csv', ['csv', 'txt'], 'profile.csv'],
    ['a name of only dots becomes "file"', '..', ['pdf'], 'file.pdf'],
    ['an empty name becomes "file"', '', ['png'], 'file.png'],
    ['a Windows device name is defused', 'CON.txt', ['txt', 'csv'], '_CON.txt'],
    ['accents are kept (and composed)', 'Lu\u0308fter-Datenblatt.pdf', ['pdf'], 'Lüfter-Datenblatt.pdf'],
  ] as const)('%s', (_case, original, extensions, expected) => {
    expect(safeFileName(original, extensions)).toBe(expected);
  });

  test('a long base is cut to 120 characters, whole code points only', () => {
    const name = safeFileName(`${'é'.repeat(60)}${'🔋'.repeat(100)}.pdf`, ['pdf']);
    const [base, extension] = [name.slice(0, name.lastIndexOf('.')), name.slice(name.lastIndexOf('.') + 1)];
    expect(Array.from(base)).toHaveLength(120);
    expect(base.endsWith('🔋')).toBe(true);
    expect(extension).toBe('pdf');
  });
});

describe('download disposition', () => {
  test('gives an ASCII fallback and the exact UTF-8 name', () => {
    expect(attachmentDisposition("Lüfter (rev 2)'s.pdf")).toBe(
      `attachment; filename="L_fter (rev 2)'s.pdf"; filename*=UTF-8''L%C3%BCfter%20%28rev%202%29%27s.pdf`,
    );
  });

  test('a quote or backslash cannot end the quoted fallback early', () => {
    expect(attachmentDisposition('a"b\\c.pdf')).toMatch(/^attachment; filename="a_b_c\.pdf"; filename\*=UTF-8''a%22b%5Cc\.pdf$/);
  });
});
