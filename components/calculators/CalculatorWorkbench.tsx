import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { runCalculator, type CalculatorDef, type CalculatorResult } from '../../shared/calculators';
import { defaultParams, type ParamValues } from '../../shared/params';
import { SafetyNotes } from '../SafetyNotes';
import { ParamForm } from '../forms/ParamForm';
import { UnitsToggle } from '../forms/UnitsToggle';
import { useDisplayUnits } from '../forms/useDisplayUnits';
import { FitReport, flaggedFields } from '../generators/FitReport';
import { colors, fonts, space, theme, useBreakpoint } from '../ui';
import { CALCULATOR_SOURCES, cautionsForCalculator } from './notes';

type Outcome = { ok: true; params: ParamValues; result: CalculatorResult } | { ok: false; fields: Record<string, string>; message: string };

function compute(id: string, values: Partial<ParamValues>): Outcome {
  try {
    return runCalculator(id, values);
  } catch (e) {
    return { ok: false, fields: {}, message: `These values could not be computed: ${(e as Error).message}` };
  }
}

/**
 * A calculator's form and its results, computed here with the shared code as you type (it is
 * arithmetic: no debounce and no server round trip needed).
 */
export function CalculatorWorkbench({ calculator, initialParams }: { calculator: CalculatorDef; initialParams?: Partial<ParamValues> }) {
  const { isWide } = useBreakpoint();
  const [units, setUnits] = useDisplayUnits();
  const startValues = useMemo(() => ({ ...defaultParams(calculator.params), ...initialParams }), [calculator, initialParams]);
  const [current, setCurrent] = useState<Outcome>(() => compute(calculator.id, startValues));
  const [lastGood, setLastGood] = useState<Extract<Outcome, { ok: true }> | null>(() => (current.ok ? current : null));
  const [formValid, setFormValid] = useState(true);

  const onValues = (values: ParamValues) => {
    const next = compute(calculator.id, values);
    setCurrent(next);
    if (next.ok) setLastGood(next);
  };

  const stale = !formValid || !current.ok;
  const fieldLabels = useMemo(() => Object.fromEntries(calculator.params.map((d) => [d.name, d.label])), [calculator]);
  const flagged = useMemo(() => flaggedFields(current.ok ? current.result.warnings : []), [current]);
  const cautions = cautionsForCalculator(calculator.id);
  // Angles and counts only: no unit to choose.
  const hasLengths = calculator.params.some((d) => d.type === 'number' && d.unit === 'mm');
  const source = CALCULATOR_SOURCES[calculator.id];

  const form = (
    <View style={theme.card}>
      <Text role="heading" style={theme.heading}>
        Inputs
      </Text>
      <ParamForm
        key={calculator.id}
        decls={calculator.params}
        initialValues={startValues}
        units={units}
        onChange={onValues}
        onValidityChange={setFormValid}
        externalErrors={current.ok ? undefined : current.fields}
        flagged={flagged}
      />
    </View>
  );
  const results = (
    <View style={{ gap: space.lg }}>
      <View style={theme.card} testID="calculator-results">
        {!current.ok ? <Text style={styles.problem}>{current.message}</Text> : null}
        {lastGood ? (
          <FitReport
            title="Results"
            values={lastGood.result.values}
            warnings={lastGood.result.warnings}
            units={units}
            fieldLabels={fieldLabels}
            stale={stale}
            footer={source ? <Text style={[theme.muted, styles.source]}>{source}</Text> : null}
          />
        ) : null}
      </View>
      {cautions.length ? <SafetyNotes only={cautions} compact /> : null}
    </View>
  );

  return (
    <View style={{ gap: space.md }}>
      {hasLengths ? <UnitsToggle units={units} onChange={setUnits} /> : null}
      {isWide ? (
        <View style={styles.columns}>
          <View style={styles.formColumn}>{form}</View>
          <View style={styles.resultsColumn}>{results}</View>
        </View>
      ) : (
        <View style={{ gap: space.lg }}>
          {form}
          {results}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  formColumn: { width: 380, flexShrink: 0 },
  resultsColumn: { flex: 1, minWidth: 0 },
  problem: { fontFamily: fonts.medium, fontSize: 14, lineHeight: 20, color: colors.danger },
  source: { marginTop: space.sm, fontStyle: 'italic' },
});
