import { Link, useLocalSearchParams } from 'expo-router';
import { ActivityIndicator, Text } from 'react-native';
import { useRevision } from '@/components/api/revisions';
import { AppFrame } from '@/components/layout/AppFrame';
import { NothingHere } from '@/components/layout/NothingHere';
import { GeneratorWorkbench } from '@/components/generators/GeneratorWorkbench';
import { useSaveToLibrary } from '@/components/generators/SaveToLibrary';
import { colors, theme } from '@/components/ui';
import { getGenerator } from '@/shared/generators';
import type { GeneratorDef } from '@/shared/generators/types';
import type { ParamValues } from '@/shared/params';

export default function GeneratorScreen() {
  // `?revision=<id>` starts from a saved revision's parameters and saves the next revision of it.
  const { id, revision } = useLocalSearchParams<{ id: string; revision?: string }>();
  const generator = typeof id === 'string' ? getGenerator(id) : undefined;
  const from = useRevision(typeof revision === 'string' ? revision : undefined);
  if (!generator) {
    return <NothingHere title="No such generator" message={`There is no generator called “${String(id)}”.`} back={{ href: '/generators', label: 'See all generators' }} />;
  }
  if (revision && from.isLoading) {
    return (
      <AppFrame title={generator.title}>
        <ActivityIndicator color={colors.pine} />
      </AppFrame>
    );
  }
  return (
    <AppFrame title={generator.title}>
      <Link href="/generators" style={theme.link}>
        ‹ All generators
      </Link>
      <Text style={theme.body}>{generator.description}</Text>
      {from.isError ? <Text style={[theme.body, { color: colors.danger }]}>Could not load that revision: {from.error.message}</Text> : null}
      <WorkbenchWithSave
        key={`${generator.id}-${from.data?.id ?? 'new'}`}
        generator={generator}
        initialParams={(from.data?.params ?? undefined) as ParamValues | undefined}
        designId={from.data?.designId}
        designTitle={from.data ? `${from.data.designTitle} (from r${from.data.number})` : undefined}
        fitNotes={from.data?.fitNotes}
      />
    </AppFrame>
  );
}

function WorkbenchWithSave(props: { generator: GeneratorDef; initialParams?: ParamValues; designId?: string; designTitle?: string; fitNotes?: import('@/shared/schemas/library').FitNotes }) {
  const { form, onSave } = useSaveToLibrary(props.generator, { designId: props.designId, designTitle: props.designTitle, fitNotes: props.fitNotes });
  return (
    <>
      {form}
      <GeneratorWorkbench generator={props.generator} initialParams={props.initialParams} onSave={onSave} initialDevice={props.fitNotes?.device?.name} />
    </>
  );
}
