import { useState } from 'react';
import type { RailSpec } from '~/lib/engine/rail-spec';
import type { Evaluation, TopologyId } from '~/lib/engine/types';
import { TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { AdjustPanel } from './AdjustPanel';
import { CalcTrace } from './CalcTrace';
import { CautionPanel } from './CautionPanel';
import { choicesFrom, type ChoicesForm, type FormIssue } from '~/lib/review/choices';
import { AGREED_FIELD_PATHS, withAgreedRequirement } from '~/lib/review/agreed-requirement';
import { CurvesChart } from './CurvesChart';
import { PartList } from './PartList';
import { MatrixKey, RankingMatrix } from '../ranking/RankingMatrix';
import { TradeoffPlot } from '../ranking/TradeoffPlot';
import { columnOrder, rankingMatrix } from '~/lib/ranking/matrix';
import { TYPICAL_NOTE } from '~/lib/review/words';
import { RevisionList, type RevisionSummary } from './RevisionList';
import { LazySchematic } from './LazySchematic';
import { SpreadChart } from './SpreadChart';
import { useKeptChoices } from './kept-choices';
import { UnsavedChoices } from './UnsavedChoices';

interface Props {
  briefId: string;
  spec: RailSpec;
  initialForm: ChoicesForm;
  initialTopology: TopologyId | null;
  initialResult: Evaluation;
  revisions: RevisionSummary[];
  linearClasses: { id: string; label: string }[];
  currency: string;
  /** The revision whose choices the form starts from, if any. */
  startedFrom: number | null;
}

type Notice = { tone: 'ok' | 'stop'; text: string } | null;

async function readIssues(response: Response, fallback: string): Promise<FormIssue[]> {
  const body = (await response.json().catch(() => null)) as { issues?: FormIssue[]; message?: string } | null;
  if (body?.issues?.length) return body.issues;
  return [{ path: '', message: body?.message ?? fallback }];
}

/** The engineer's working area for one brief: adjust, re-run, compare the options, choose one and save it. */
export default function ReviewDesk(props: Props) {
  const { briefId, spec, linearClasses, currency } = props;
  const [form, setForm] = useState(props.initialForm);
  const kept = useKeptChoices(briefId, { form: props.initialForm, revision: props.startedFrom }, form, setForm);
  const [ran, setRan] = useState(props.initialForm);
  const [result, setResult] = useState(props.initialResult);
  const [chosen, setChosen] = useState<TopologyId | null>(
    props.initialTopology ?? props.initialResult.recommended ?? props.initialResult.options[0]?.topology ?? null,
  );
  const [running, setRunning] = useState(false);
  const [issues, setIssues] = useState<FormIssue[]>([]);
  const [note, setNote] = useState('');
  const [saving, setSaving] = useState(false);
  const [notice, setNotice] = useState<Notice>(null);
  const [revisions, setRevisions] = useState(props.revisions);
  /** The part marked in the drawing, the part list and the trace. */
  const [selectedRef, setSelectedRef] = useState<string | null>(null);

  const option = result.options.find((o) => o.topology === chosen) ?? result.options[0] ?? null;
  const dirty = JSON.stringify(form) !== JSON.stringify(ran);

  async function rerun() {
    const choices = choicesFrom(form);
    if (!choices.ok) {
      setIssues(choices.issues);
      return;
    }
    setRunning(true);
    setNotice(null);
    try {
      const response = await fetch('/api/v1/evaluate', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({
          ...withAgreedRequirement(spec, choices.value.requirement),
          weights: choices.value.weights,
          overrides: choices.value.overrides,
        }),
      });
      if (!response.ok) {
        const problems = await readIssues(response, 'The engine could not run with these choices.');
        setIssues(problems.map((p) => ({ ...p, path: AGREED_FIELD_PATHS[p.path] ?? p.path })));
        return;
      }
      const next = (await response.json()) as Evaluation;
      setResult(next);
      setRan(form);
      setIssues([]);
      // Keep the engineer's pick when it still exists; otherwise follow the new recommendation.
      if (!next.options.some((o) => o.topology === chosen)) setChosen(next.recommended ?? next.options[0]?.topology ?? null);
    } catch {
      setIssues([{ path: '', message: 'The engine is not reachable right now. Check the connection and re-run.' }]);
    } finally {
      setRunning(false);
    }
  }

  async function save() {
    const choices = choicesFrom(ran);
    if (!choices.ok || !chosen) return;
    setSaving(true);
    setNotice(null);
    try {
      const response = await fetch(`/api/v1/briefs/${briefId}/revisions`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ topology: chosen, ...choices.value, note }),
      });
      if (response.status !== 201) {
        const problems = await readIssues(response, 'The revision was not saved.');
        setNotice({ tone: 'stop', text: problems.map((p) => p.message).join(' ') });
        return;
      }
      const saved = (await response.json()) as { number: number };
      kept.saved(ran, saved.number);
      const list = await fetch(`/api/v1/briefs/${briefId}/revisions`);
      if (list.ok) setRevisions(((await list.json()) as { items: RevisionSummary[] }).items);
      setNote('');
      setNotice({ tone: 'ok', text: `Revision ${saved.number} saved: ${TOPOLOGY_NAMES[chosen]}.` });
    } catch {
      setNotice({ tone: 'stop', text: 'The revision was not saved: the server is not reachable. Try again.' });
    } finally {
      setSaving(false);
    }
  }

  return (
    <div className="flex flex-col gap-8">
      {option && <CautionPanel cautions={option.cautions} heading={`Cautions for the ${TOPOLOGY_NAMES[option.topology].toLowerCase()}`} />}

      <UnsavedChoices kept={kept} />
      <AdjustPanel
        form={form}
        onChange={setForm}
        onRun={rerun}
        running={running}
        dirty={dirty}
        issues={issues}
        linearClasses={linearClasses}
        briefed={spec}
      />

      <section aria-labelledby="options-heading">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="options-heading" className="text-xl font-bold">
            Ways to build it, side by side
          </h2>
          <p className="text-sm text-ink-soft">
            {result.recommended
              ? `Our pick: ${TOPOLOGY_NAMES[result.recommended]}. ${result.options.filter((o) => o.feasible).length} of ${result.options.length} can be built.`
              : 'No way can be built as briefed; what stops each one is in its column.'}
            {props.startedFrom !== null && !dirty && JSON.stringify(ran) === JSON.stringify(props.initialForm)
              ? ` Choices of revision ${props.startedFrom}.`
              : ''}
          </p>
        </div>
        {result.reason && <p className="mt-1 text-sm text-ink">{result.reason}</p>}
        <div className="mt-3">
          <RankingMatrix
            matrix={rankingMatrix(result, {
              railPowerW: spec.output.v * spec.output.iMax,
              rippleLimitVpp: spec.noise.maxRippleVpp,
              currency,
            })}
            choice={{ chosen, onChoose: setChosen }}
            busy={running}
          />
          <MatrixKey />
          <p className="mt-1 text-xs text-ink-faint">Figures other than the part count are {TYPICAL_NOTE}.</p>
        </div>
        <div className="mt-4">
          <TradeoffPlot options={result.options} recommended={result.recommended} currency={currency} />
        </div>
      </section>

      <section aria-labelledby="charts-heading">
        <h2 id="charts-heading" className="text-xl font-bold">
          Across the input range
        </h2>
        <div className="mt-3 grid gap-3 lg:grid-cols-2">
          <CurvesChart options={columnOrder(result)} kind="efficiency" pick={result.recommended} nominalV={spec.input.vNom} />
          <CurvesChart options={columnOrder(result)} kind="dissipation" pick={result.recommended} nominalV={spec.input.vNom} />
        </div>
        {option && (
          <div className="mt-3">
            <SpreadChart option={option} target={spec.output.v} tolerance={spec.output.tolerance} />
          </div>
        )}
      </section>

      {option && (
        <section aria-labelledby="save-heading" className="rounded-lg border border-copper-600/40 bg-copper-50 p-4">
          <h2 id="save-heading" className="text-xl font-bold">
            Save as a revision
          </h2>
          <p className="mt-1 text-sm text-ink-soft">
            Saves the chosen option, <strong>{TOPOLOGY_NAMES[option.topology]}</strong>, with the weights and overrides of the last run.
            {dirty ? ' The form has changes that are not in the figures yet; re-run first to include them.' : ''}
          </p>
          <div className="mt-3 flex flex-col gap-1">
            <label htmlFor="revision-note" className="text-sm font-semibold">
              Note for the record
            </label>
            <textarea
              id="revision-note"
              rows={3}
              maxLength={4000}
              value={note}
              onChange={(e) => setNote(e.target.value)}
              className="rounded-md border border-ink/25 bg-card px-3 py-2"
              placeholder="What you changed and why"
            />
          </div>
          <div className="mt-3 flex flex-wrap items-center gap-3">
            <button
              type="button"
              onClick={save}
              disabled={saving || running}
              className="rounded-md border border-copper-700 bg-copper-700 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-600 disabled:opacity-50"
            >
              {saving ? 'Saving…' : 'Save revision'}
            </button>
            <p
              role="status"
              aria-live="polite"
              className={`text-sm font-medium ${notice?.tone === 'stop' ? 'text-stop-700' : 'text-ok-700'}`}
            >
              {notice && <span aria-hidden="true">{notice.tone === 'stop' ? '✕ ' : '✓ '}</span>}
              {notice?.text}
            </p>
          </div>
        </section>
      )}

      {option && (
        <section aria-labelledby="chosen-heading">
          <h2 id="chosen-heading" className="text-xl font-bold">
            The chosen design: {TOPOLOGY_NAMES[option.topology]}
          </h2>
          <h3 className="mt-4 text-base font-bold">Schematic</h3>
          <div className="mt-2">
            <LazySchematic
              options={result.options}
              chosen={option}
              spec={spec}
              selected={selectedRef}
              onSelect={setSelectedRef}
              onChoose={setChosen}
              describedBy="chosen-part-list"
            />
          </div>
          <h3 className="mt-6 text-base font-bold">Part list</h3>
          <div className="mt-2">
            <PartList option={option} currency={currency} id="chosen-part-list" selected={selectedRef} onSelect={setSelectedRef} />
          </div>
          <h3 className="mt-6 text-base font-bold">Calculation trace</h3>
          <p className="text-sm text-ink-soft">
            Every figure with its equation and inputs. Save a revision to print it as a calculation sheet.
          </p>
          <div className="mt-2">
            <CalcTrace option={option} selected={selectedRef} />
          </div>
        </section>
      )}

      <RevisionList briefId={briefId} revisions={revisions} />
    </div>
  );
}
