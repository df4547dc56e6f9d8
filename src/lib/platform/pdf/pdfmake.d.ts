// The small part of pdfmake 0.3's server API that Railwright uses (the package ships no types).
declare module 'pdfmake' {
  interface OutputDocument {
    getBuffer(): Promise<Buffer>;
  }
  interface VirtualFileSystem {
    writeFileSync(filename: string, content: Buffer): void;
    existsSync(filename: string): boolean;
  }
  interface PdfMake {
    virtualfs: VirtualFileSystem;
    setFonts(fonts: Record<string, { normal: string; bold: string; italics: string; bolditalics: string }>): void;
    setUrlAccessPolicy(allow: (url: string) => boolean): void;
    setLocalAccessPolicy(allow: (path: string) => boolean): void;
    createPdf(definition: object): OutputDocument;
  }
  const pdfmake: PdfMake;
  export default pdfmake;
}
