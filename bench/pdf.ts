/** One quote PDF rendered in-process, warm: the seeded quote of the benchmark server's database. */
import { performance } from 'node:perf_hooks';
import { eq } from 'drizzle-orm';
import { connect } from '../src/lib/platform/db/connect';
import { quote } from '../src/lib/platform/db/schema';
import { renderQuotePdf } from '../src/lib/quotes/render.server';
import { loadQuoteView } from '../src/lib/quotes/view.server';
import { median } from './engine';

export async function pdfMedianMs(databaseUrl: string, runs = 30): Promise<number> {
  const { db, client } = connect(databaseUrl);
  try {
    const [row] = await db.select({ id: quote.id }).from(quote).where(eq(quote.state, 'sent')).limit(1);
    const view = row ? await loadQuoteView(db, row.id) : null;
    if (!view) throw new Error('The benchmark database has no sent quote to render.');
    const options = { quoteUrl: 'https://railwright.example/quotes/bench' };
    for (let i = 0; i < 5; i++) await renderQuotePdf(view, options);
    const times: number[] = [];
    for (let i = 0; i < runs; i++) {
      const t = performance.now();
      await renderQuotePdf(view, options);
      times.push(performance.now() - t);
    }
    return median(times);
  } finally {
    client.close();
  }
}
