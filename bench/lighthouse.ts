/** Lighthouse performance and accessibility in Debian's Chromium, default (mobile) settings. */
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';

export interface PageScore {
  page: string;
  performance: number | null;
  accessibility: number | null;
}

export async function lighthouseScores(pages: { name: string; url: string; cookie?: string }[]): Promise<PageScore[]> {
  const chrome = await chromeLauncher.launch({
    chromePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    chromeFlags: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  try {
    const scores: PageScore[] = [];
    for (const page of pages) {
      const result = await lighthouse(page.url, {
        port: chrome.port,
        output: 'json',
        logLevel: 'error',
        onlyCategories: ['performance', 'accessibility'],
        ...(page.cookie ? { extraHeaders: { cookie: page.cookie } } : {}),
      });
      const categories = result?.lhr.categories;
      scores.push({
        page: page.name,
        performance: categories?.performance?.score == null ? null : Math.round(categories.performance.score * 100),
        accessibility: categories?.accessibility?.score == null ? null : Math.round(categories.accessibility.score * 100),
      });
    }
    return scores;
  } finally {
    chrome.kill();
  }
}
