import type { briefDetail, BriefRow } from './briefs.server';

/** The API's view of a brief: dates as ISO strings, nothing internal. */
export function briefJson(row: BriefRow) {
  return {
    id: row.id,
    title: row.title,
    state: row.state,
    spec: row.spec,
    notes: row.notes,
    recommendedTopology: row.recommendedTopology,
    summary: row.summary,
    submittedAt: row.submittedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export function briefDetailJson(detail: Awaited<ReturnType<typeof briefDetail>>) {
  return {
    ...briefJson(detail),
    owner: detail.owner,
    files: detail.files.map((f) => ({ ...f, createdAt: f.createdAt.toISOString(), url: `/api/v1/files/${f.id}` })),
    history: detail.history.map((h) => ({ ...h, at: h.at.toISOString() })),
  };
}
