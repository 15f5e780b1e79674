import { router, useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { Text, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { useDesign, useUpdateDesign } from '@/components/api/designs';
import { ActivityLog } from '@/components/designs/ActivityLog';
import { DesignForm } from '@/components/designs/DesignForm';
import { DownloadPanel } from '@/components/designs/DownloadPanel';
import { FitNotesView, GeometrySummaryView } from '@/components/designs/FitNotesView';
import { ForkPanel } from '@/components/designs/ForkPanel';
import { Lineage } from '@/components/designs/Lineage';
import { RevisionDrawing } from '@/components/designs/RevisionDrawing';
import { RevisionHistory, sourceText } from '@/components/designs/RevisionHistory';
import { ShopLine } from '@/components/designs/ShopLine';
import { Segmented } from '@/components/forms/Segmented';
import { useDisplayUnits } from '@/components/forms/useDisplayUnits';
import { AppFrame } from '@/components/layout/AppFrame';
import { Button, formatWhen, KIND_LABEL, LinkButton, Loading, Notice, Section, StatusBadge, Tag } from '@/components/library/controls';
import { canEdit, useRoleIn } from '@/components/library/shopAccess';
import { useShopOfScreen } from '@/components/shop/CurrentShop';
import { space, theme, useBreakpoint } from '@/components/ui';
import type { DesignDetail } from '@/shared/schemas/library';

export default function DesignScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const design = useDesign(id);
  useShopOfScreen(design.data?.shopId);
  if (design.isLoading) {
    return (
      <AppFrame title="Design">
        <Loading label="Fetching the design…" />
      </AppFrame>
    );
  }
  if (design.isError || !design.data) {
    const e = design.error;
    const missing = e instanceof ApiError && e.status === 404;
    const signedOut = e instanceof ApiError && e.status === 401;
    return (
      <AppFrame title={missing ? 'Design not found' : 'Design'}>
        <Notice
          title={missing ? 'No such design here' : signedOut ? 'Sign in first' : 'The design could not be loaded'}
          action={missing || signedOut ? <LinkButton href={signedOut ? '/sign-in' : '/library'} tone="secondary" label={signedOut ? 'Sign in' : 'Back to the library'} /> : <Button tone="secondary" label="Try again" onPress={() => design.refetch()} />}
        >
          {missing ? 'It does not exist, or it belongs to a shop you are not a member of.' : (e?.message ?? 'Unknown error')}
        </Notice>
      </AppFrame>
    );
  }
  return (
    <AppFrame title={design.data.title}>
      <DesignPage design={design.data} />
    </AppFrame>
  );
}

function DesignPage({ design }: { design: DesignDetail }) {
  const { isWide } = useBreakpoint();
  const params = useLocalSearchParams<{ r?: string }>();
  const [units, setUnits] = useDisplayUnits();
  const role = useRoleIn(design.shopId);
  const editable = canEdit(role);
  const [panel, setPanel] = useState<'none' | 'fork' | 'edit'>('none');
  const update = useUpdateDesign(design.id);

  const wanted = Number(params.r);
  const selected = design.revisions.find((r) => r.number === wanted) ?? design.revisions[0];

  return (
    <View style={{ gap: space.lg }}>
      <View style={theme.card}>
        <ShopLine shopName={design.shopName} />
        <View style={[theme.row, { flexWrap: 'wrap' }]}>
          <Text style={theme.label}>{KIND_LABEL[design.kind]}</Text>
          {design.material ? <Text style={theme.muted}>· {design.material}</Text> : null}
        </View>
        {design.description ? <Text style={theme.body}>{design.description}</Text> : null}
        {design.tags.length ? (
          <View style={[theme.row, { flexWrap: 'wrap', gap: 4 }]}>
            {design.tags.map((t) => (
              <Tag key={t} label={t} onPress={() => router.push(`/library?tag=${encodeURIComponent(t)}` as never)} />
            ))}
          </View>
        ) : null}
        <Text style={theme.muted}>
          Added by {design.author?.name ?? 'someone no longer in the shop'} on {formatWhen(design.createdAt)}; last changed {formatWhen(design.updatedAt, true)}
        </Text>
        <Lineage design={design} />
        <View style={[theme.row, { flexWrap: 'wrap', marginTop: space.sm }]}>
          {editable ? <LinkButton href={`/designs/${design.id}/upload`} label={design.revisions.length ? 'Upload new revision' : 'Upload the first cut file'} testID="upload-revision" /> : null}
          {design.revisions.length ? <Button tone="secondary" label="Fork…" onPress={() => setPanel(panel === 'fork' ? 'none' : 'fork')} testID="fork-open" /> : null}
          {editable ? <Button tone="quiet" label="Edit details" onPress={() => setPanel(panel === 'edit' ? 'none' : 'edit')} testID="edit-open" /> : null}
        </View>
      </View>

      {panel === 'fork' ? (
        <Section title="Fork this design">
          <ForkPanel design={design} initialRevisionId={selected?.id} onClose={() => setPanel('none')} />
        </Section>
      ) : null}
      {panel === 'edit' ? (
        <Section title="Edit details">
          <DesignForm
            mode="edit"
            initial={{ kind: design.kind, title: design.title, description: design.description, tags: design.tags, material: design.material }}
            submitLabel="Save details"
            onCancel={() => setPanel('none')}
            onSubmit={async ({ kind: _kind, ...patch }) => {
              await update.mutateAsync(patch);
              setPanel('none');
            }}
          />
        </Section>
      ) : null}

      {!selected ? (
        <Notice tone="info" title="No revision yet">
          {editable ? 'Upload a DXF or SVG to make r1. Jigwright checks the file and shows what it read before anything is saved.' : 'An editor of this shop has not added a cut file yet.'}
        </Notice>
      ) : (
        <>
          <Section
            title={`r${selected.number}`}
            testID="selected-revision"
            right={<Segmented label="Units" options={[{ value: 'mm', label: 'mm' }, { value: 'in', label: 'inches' }]} value={units} onChange={setUnits} />}
          >
            <View style={[theme.row, { flexWrap: 'wrap' }]}>
              <StatusBadge status={selected.status} />
              <Text style={theme.muted}>
                {sourceText(selected)} · {selected.author?.name ?? 'someone no longer in the shop'} · {formatWhen(selected.createdAt, true)}
              </Text>
            </View>
            <Text style={theme.body}>{selected.message}</Text>
            <View style={{ flexDirection: isWide ? 'row' : 'column', gap: space.lg, alignItems: 'flex-start' }}>
              <View style={{ flex: isWide ? 3 : undefined, width: isWide ? undefined : '100%', minWidth: 0 }}>
                <RevisionDrawing revision={selected} units={units} title={design.title} />
              </View>
              <View style={{ flex: isWide ? 2 : undefined, width: isWide ? undefined : '100%', gap: space.md, minWidth: 0 }}>
                <Text style={theme.heading}>Made to fit</Text>
                <FitNotesView notes={selected.fitNotes} units={units} />
                <Text style={theme.heading}>Geometry</Text>
                <GeometrySummaryView summary={selected.summary} units={units} />
              </View>
            </View>
          </Section>
          <Section title={`Cut files for r${selected.number}`}>
            <DownloadPanel revision={selected} kind={design.kind} />
          </Section>
        </>
      )}

      <View style={{ flexDirection: isWide ? 'row' : 'column', gap: space.lg, alignItems: 'flex-start' }}>
        {design.revisions.length ? (
          <View style={{ flex: isWide ? 1 : undefined, width: isWide ? undefined : '100%' }}>
            <Section title={`Revisions (${design.revisions.length})`}>
              <RevisionHistory designId={design.id} revisions={design.revisions} selectedId={selected?.id} onSelect={(r) => router.setParams({ r: String(r.number) })} editable={editable} />
            </Section>
          </View>
        ) : null}
        <View style={{ flex: isWide ? 1 : undefined, width: isWide ? undefined : '100%' }}>
          <Section title="Activity">
            <ActivityLog activity={design.activity} />
          </Section>
        </View>
      </View>
    </View>
  );
}
