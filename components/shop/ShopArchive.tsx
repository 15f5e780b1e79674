// The owner's archive panel: download the whole library, or import an archive into this shop. An
// archive the shop already has is refused with the server's own words (when, by whom, how many
// designs, nothing added); the owner may then import it again, on purpose, as a further copy.
import { counted } from '../../shared/words';
import { useRef, useState } from 'react';
import { Text, View } from 'react-native';
import { ALREADY_IMPORTED, archiveDownloadUrl, useImportArchive, type ArchiveImportResult } from '../api/archive';
import { ApiError } from '../api/client';
import type { UploadProgress } from '../api/upload';
import { FilePicker } from '../designs/FilePicker';
import { Button, Loading, Notice } from '../library/controls';
import { space, theme } from '../ui';

type State =
  | { step: 'idle' }
  | { step: 'sending'; file: File; again: boolean; progress: UploadProgress | null }
  | { step: 'done'; file: File; result: ArchiveImportResult }
  | { step: 'already'; file: File; message: string }
  | { step: 'failed'; file: File; message: string };

function summary(r: ArchiveImportResult): string {
  const parts = [counted(r.designs, 'design'), counted(r.revisions, 'revision'), counted(r.files, 'file'), counted(r.cutLogs, 'cut log')];
  const catalog = [
    r.devices.added || r.devices.skipped ? `devices: ${r.devices.added} added${r.devices.skipped ? `, ${r.devices.skipped} already in the catalog` : ''}` : '',
    r.chargers.added || r.chargers.skipped ? `charger pads: ${r.chargers.added} added${r.chargers.skipped ? `, ${r.chargers.skipped} already in the catalog` : ''}` : '',
  ].filter(Boolean);
  return `${parts.join(', ')}${r.photos ? ` (${counted(r.photos, 'photo')})` : ''}${catalog.length ? `; ${catalog.join('; ')}` : ''}.`;
}

export function ShopArchive({ shopId, shopName }: { shopId: string; shopName: string }) {
  const importer = useImportArchive(shopId);
  const [state, setState] = useState<State>({ step: 'idle' });
  const abort = useRef<AbortController | null>(null);

  const send = async (file: File, again: boolean) => {
    abort.current?.abort();
    const ctrl = new AbortController();
    abort.current = ctrl;
    setState({ step: 'sending', file, again, progress: null });
    try {
      const result = await importer.mutateAsync({ file, again, signal: ctrl.signal, onProgress: (progress) => setState({ step: 'sending', file, again, progress }) });
      setState({ step: 'done', file, result });
    } catch (e) {
      if (e instanceof ApiError && e.code === 'aborted') {
        setState({ step: 'idle' });
        return;
      }
      const message = e instanceof Error ? e.message : String(e);
      setState(e instanceof ApiError && e.status === 409 && e.code === ALREADY_IMPORTED ? { step: 'already', file, message } : { step: 'failed', file, message });
    }
  };

  const sending = state.step === 'sending';
  const f = sending ? state.progress?.fraction : null;
  // Once every byte is sent the server is importing; cancelling then would only hide the answer.
  const sent = f !== null && f !== undefined && f >= 1;
  return (
    <View style={{ gap: space.md }} testID="shop-archive">
      <Text style={theme.body}>
        The whole library of {shopName} — every design, revision, drawing file, cut log and photo, and the device and charger catalog — as one .tar.gz file, to keep
        as a backup or to bring into another shop you own.
      </Text>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap' }}>
        <Text
          {...({ href: archiveDownloadUrl(shopId), hrefAttrs: { download: true, rel: 'noopener' } } as object)}
          accessibilityRole="link"
          style={theme.link}
          testID="archive-download"
        >
          Download the whole library
        </Text>
      </View>

      <Text style={theme.label}>Import an archive into {shopName}</Text>
      <Text style={theme.muted}>
        Its designs are added beside the ones already here, with new ids; nothing here is changed or replaced. Devices and charger pads whose name is already in the
        catalog are left as they are. If anything in the file is wrong, nothing is imported.
      </Text>
      <FilePicker
        accept=".tar.gz,.tgz,application/gzip"
        label="Choose an archive to import"
        hint="or drop a Jigwright shop archive (.tar.gz) here"
        disabled={sending}
        onPick={(file) => send(file, false)}
      />

      {sending ? (
        <View style={{ gap: space.sm }}>
          <Loading
            label={
              sent
                ? `Sent; checking every file and importing${state.again ? ' as copies' : ''}…`
                : `Sending ${state.file.name}${f == null ? '' : ` (${Math.round(f * 100)} %)`}…`
            }
          />
          {sent ? null : <Button tone="quiet" label="Stop sending" onPress={() => abort.current?.abort()} testID="archive-cancel" />}
        </View>
      ) : null}

      {state.step === 'done' ? (
        <Notice tone="ok" title={state.result.copyOf ? `Imported ${state.file.name} again, as copies` : `Imported ${state.file.name}`}>
          <Text style={theme.body} testID="archive-imported">
            {state.result.copyOf ? 'A further copy of every design in it is now in this shop: ' : 'Added to this shop: '}
            {summary(state.result)}
          </Text>
        </Notice>
      ) : null}

      {state.step === 'already' ? (
        <Notice
          tone="info"
          title="This archive is already in this shop"
          action={
            <View style={[theme.row, { flexWrap: 'wrap', gap: space.sm }]}>
              <Button label="Import it again as copies" onPress={() => send(state.file, true)} testID="archive-import-again" accessibilityLabel={`Import ${state.file.name} again as a second copy of every design in it`} />
              <Button tone="quiet" label="Leave it as it is" onPress={() => setState({ step: 'idle' })} testID="archive-leave" />
            </View>
          }
        >
          <Text style={theme.body} testID="archive-already">
            {state.message}
          </Text>
          <Text style={theme.muted}>Importing it again adds one more copy of each of its designs; the designs already here stay as they are.</Text>
        </Notice>
      ) : null}

      {state.step === 'failed' ? (
        <Notice title={`${state.file.name} was not imported`}>
          <Text style={theme.body} testID="archive-failed">
            {state.message}
          </Text>
        </Notice>
      ) : null}
    </View>
  );
}
