import { useState } from 'react';
import { View } from 'react-native';
import type { Drill, DrillResult } from '@/shared/schemas/drill';
import { ApiRequestError, NetworkError } from '@/components/data/api-client';
import { useLengthUnits } from '@/components/data/session';
import { answerDrill, getDrill, trainerKeys } from '@/components/data/trainer';
import { deviceOutbox } from '@/components/offline/device-outbox';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { DrillSideView, FigureRows } from './side-view';
import { DRILL_KIND_LABELS, scoreBand, showAnswer, sideViewRows, TRAINER_CAUTIONS } from './trainer-format';

export type DrillOutcome = { kind: 'scored'; result: DrillResult } | { kind: 'kept' };

/** The result of an answer already given (a drill reopened after it was answered). */
function storedResult(drill: Drill): DrillResult | null {
  if (!drill.result) return null;
  return {
    correctValue: drill.result.correctValue,
    score: drill.result.score,
    explanation: drill.result.explanation,
    unit: drill.question.unit,
    attempt: null,
    replayed: true,
  };
}

/**
 * One question: its text and inputs in the person's units, a number (or
 * yes/no) answer; then the score and its band, the working, the side view and
 * the cautions. Without a network the answer is kept on the device and
 * scored once it is sent.
 */
export function DrillCard({
  drill,
  position,
  onAnswered,
  onNext,
  nextLabel = 'Next question',
  refreshKeys = [],
}: {
  drill: Drill;
  position?: string;
  onAnswered?: (outcome: DrillOutcome) => void;
  onNext?: () => void;
  nextLabel?: string;
  refreshKeys?: readonly (readonly unknown[])[];
}) {
  const units = useLengthUnits();
  const [text, setText] = useState('');
  const [error, setError] = useState('');
  const [busy, setBusy] = useState(false);
  const [outcome, setOutcome] = useState<DrillOutcome | null>(() => {
    const r = storedResult(drill);
    return r ? { kind: 'scored', result: r } : null;
  });
  const q = drill.question;
  const yesNo = q.unit === 'yes-no';

  const send = async (value: number | boolean) => {
    setError('');
    setBusy(true);
    try {
      const result = await answerDrill(drill.id, value);
      const done: DrillOutcome = { kind: 'scored', result };
      setOutcome(done);
      onAnswered?.(done);
    } catch (e) {
      if (e instanceof NetworkError) {
        await deviceOutbox.add({
          key: `drill-answer:${drill.id}`,
          label:
            `Answer ${position ?? ''} (${DRILL_KIND_LABELS[drill.kind]}): ${String(value)}${yesNo ? '' : ` ${q.unit}`}`.replace(
              '  ',
              ' ',
            ),
          path: `/v1/drills/${drill.id}/answer`,
          body: { value },
          refresh: [trainerKeys.all, ...refreshKeys],
        });
        const kept: DrillOutcome = { kind: 'kept' };
        setOutcome(kept);
        onAnswered?.(kept);
      } else if (e instanceof ApiRequestError && e.code === 'already_answered') {
        // Answered before (e.g. from this device's outbox): show what the server kept.
        const stored = storedResult(await getDrill(drill.id).catch(() => drill));
        if (stored) {
          const done: DrillOutcome = { kind: 'scored', result: stored };
          setOutcome(done);
          onAnswered?.(done);
        } else setError(e.message);
      } else setError(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  };

  const submitNumber = () => {
    const value = Number(text.trim().replace(',', '.'));
    if (text.trim() === '' || !Number.isFinite(value)) {
      setError(`Answer with a number in ${q.unit}.`);
      return;
    }
    void send(value);
  };

  const inputs = sideViewRows(
    Object.fromEntries(Object.entries(q.inputs).filter(([k]) => k !== 'targetName' && k !== 'conditionSetName')),
    units,
  );

  return (
    <Card accent="moss" aria-label="Question" style={{ gap: space.md }}>
      <AppText variant="small" tone="muted">
        {position ? `${position} · ` : ''}
        {DRILL_KIND_LABELS[drill.kind]}
      </AppText>
      <AppText variant="heading">{q.text}</AppText>
      <FigureRows rows={inputs} label="Given" />
      {outcome === null ? (
        <>
          <FormError message={error} />
          {yesNo ? (
            <View style={{ flexDirection: 'row', gap: space.sm }}>
              <Button label="Yes" busy={busy} disabled={busy} onPress={() => void send(true)} />
              <Button label="No" kind="secondary" busy={busy} disabled={busy} onPress={() => void send(false)} />
            </View>
          ) : (
            <>
              <TextField
                label="Your answer"
                unit={q.unit}
                keyboardType="decimal-pad"
                inputMode="decimal"
                value={text}
                onChangeText={setText}
                onSubmitEditing={submitNumber}
              />
              <Button label="Answer" busy={busy} disabled={busy} onPress={submitNumber} style={{ alignSelf: 'flex-start' }} />
            </>
          )}
        </>
      ) : outcome.kind === 'kept' ? (
        <Notice tone="info" title="Answer kept on this device">
          <AppText>It will be sent and scored when the network is back. You can go on to the next question.</AppText>
        </Notice>
      ) : (
        <Explanation result={outcome.result} units={units} />
      )}
      {outcome !== null && onNext ? <Button label={nextLabel} onPress={onNext} style={{ alignSelf: 'flex-start' }} /> : null}
    </Card>
  );
}

function Explanation({ result, units }: { result: DrillResult; units: ReturnType<typeof useLengthUnits> }) {
  const band = scoreBand(result.score, result.explanation.scoring);
  return (
    <View style={{ gap: space.md }} aria-label="Explanation">
      <Notice tone={band.band === 'none' ? 'danger' : 'info'} title={`Score ${Math.round(result.score * 100)} %`}>
        <AppText>{band.text}</AppText>
        <AppText>Correct: {showAnswer(result.correctValue, result.unit)}.</AppText>
        <AppText variant="small" tone="muted">
          {result.explanation.scoring.why}
        </AppText>
      </Notice>
      <AppText>{result.explanation.text}</AppText>
      <View style={{ gap: space.xs }}>
        <AppText variant="label">Formula with the values</AppText>
        <AppText variant="small" style={{ fontFamily: 'monospace' }} selectable>
          {result.explanation.formula}
        </AppText>
      </View>
      <DrillSideView view={result.explanation.sideView} units={units} />
      <Notice title="Cautions">
        {[...result.explanation.cautions.map((c) => c.message), ...TRAINER_CAUTIONS]
          .filter((m, i, all) => all.indexOf(m) === i)
          .map((m) => (
            <AppText key={m} variant="small">
              {m}
            </AppText>
          ))}
      </Notice>
    </View>
  );
}
