// pdf-parse 1 ships no types; the field sheet tests use its library entry and these fields.
declare module 'pdf-parse/lib/pdf-parse.js' {
  interface PdfText {
    numpages: number;
    text: string;
    info: Record<string, unknown>;
  }
  export default function pdfParse(data: Buffer): Promise<PdfText>;
}
