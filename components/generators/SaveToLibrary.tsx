import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, Text, TextInput, View } from 'react-native';
import { ApiError, api } from '../api/client';
import { useCreateDesign, type SavedRevision } from '../api/designs';
import { canEdit, useCurrentShop } from '../library/shopAccess';
import { colors, radius, space, theme, type } from '../ui';
import type { WorkbenchSaveContext } from './GeneratorWorkbench';
import type { GeneratorDef, GeneratorResult } from '../../shared/generators/types';
import { fitNotesFromParams } from '../../shared/generators/fitNotes';
import type { ParamValues } from '../../shared/params';
import type { FitNotes } from '../../shared/schemas/library';

export interface SaveTarget {
  /** Save as a new revision of this design; without it a new design is created first. */
  designId?: string;
  designTitle?: string;
  fitNotes?: FitNotes;
}

/**
 * The "save as new revision" half of a generator page: a change message (and a title for a new
 * design), and the save itself. The server regenerates from the parameters before storing.
 */
export function useSaveToLibrary(generator: GeneratorDef, target: SaveTarget) {
  const shop = useCurrentShop();
  const router = useRouter();
  const createDesign = useCreateDesign(shop?.shopId);
  const [title, setTitle] = useState('');
  const [message, setMessage] = useState(target.designId ? '' : 'First draw');
  const [error, setError] = useState<string | null>(null);
  const allowed = !!shop && canEdit(shop.role);

  async function save(params: ParamValues, _result?: GeneratorResult, context: WorkbenchSaveContext = {}) {
    setError(null);
    if (!target.designId && !title.trim()) throw new ApiError(400, 'invalid_input', 'Give the new design a title');
    if (!message.trim()) throw new ApiError(400, 'invalid_input', 'Say what changed in this revision');
    try {
      const designId = target.designId ?? (await createDesign.mutateAsync({ kind: generator.kind, title: title.trim() })).id;
      const fitNotes: FitNotes = { ...(target.fitNotes ?? {}), ...fitNotesFromParams(generator.id, params) };
      // The device chosen from the catalog is the one this revision fits, by name.
      if (context.deviceName && fitNotes.device) fitNotes.device = { ...fitNotes.device, name: context.deviceName };
      const saved = await api<SavedRevision>(`/designs/${designId}/revisions`, {
        method: 'POST',
        json: { generatorId: generator.id, params, message: message.trim(), fitNotes },
      });
      router.push(`/designs/${designId}?r=${saved.number}` as never);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
      throw e;
    }
  }

  const form = allowed ? (
    <View style={styles.box}>
      <Text style={theme.heading}>{target.designId ? `New revision of ${target.designTitle ?? 'this design'}` : 'Save to the library'}</Text>
      {!target.designId ? (
        <View style={styles.field}>
          <Text style={theme.label}>Title of the new design</Text>
          <TextInput aria-label="Title of the new design" value={title} onChangeText={setTitle} style={styles.input} placeholder="e.g. Hall table charger plate" />
        </View>
      ) : null}
      <View style={styles.field}>
        <Text style={theme.label}>What changed</Text>
        <TextInput aria-label="What changed" value={message} onChangeText={setMessage} style={styles.input} placeholder="e.g. 0.2 mm more clearance after the test cut" />
      </View>
      {error ? <Text style={[theme.body, { color: colors.danger }]}>{error}</Text> : null}
    </View>
  ) : null;
  return { form, onSave: allowed ? save : undefined };
}

const styles = StyleSheet.create({
  box: { backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.lg, gap: space.md },
  field: { gap: space.xs },
  input: { ...type.body, color: colors.ink, borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, paddingHorizontal: space.md, paddingVertical: space.sm, backgroundColor: colors.paper },
});
