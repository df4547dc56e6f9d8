import type { QuoteView } from './view.server';
import { pdfmake } from '../platform/pdf/fonts';
import { quoteDocument, type QuoteDocumentOptions } from './document.server';

export async function renderQuotePdf(view: QuoteView, options: QuoteDocumentOptions): Promise<Buffer> {
  return pdfmake.createPdf(quoteDocument(view, options)).getBuffer();
}

/** The PDF's file name, in downloads and e-mail attachments alike. */
export function quotePdfName(number: string): string {
  return `Railwright-quote-${number}.pdf`;
}
