// One revision: its drawing with pan and zoom (top face, or the underside as cut after turning the
// plate over), sizes, fit notes, files, printable templates, regenerate, compare links, cut log.
import type makerjs from 'makerjs';
import { Link } from 'expo-router';
import { useMemo, useState } from 'react';
import { Text, View } from 'react-native';
import type { DesignDetail } from '../../shared/schemas/library';
import { useRevisionModel, type RevisionWithTitle } from '../api/revisions';
import { CutLog } from '../cuts/CutLog';
import { DownloadPanel } from '../designs/DownloadPanel';
import { ShopLine } from '../designs/ShopLine';
import { FitNotesView, GeometrySummaryView } from '../designs/FitNotesView';
import { modelLayerPaths } from '../designs/modelPaths';
import { PanZoomDrawing } from '../drawing/PanZoomDrawing';
import { Segmented } from '../forms/Segmented';
import { UnitsToggle } from '../forms/UnitsToggle';
import { useDisplayUnits } from '../forms/useDisplayUnits';
import { formatWhen, Loading, Notice, Section, StatusBadge } from '../library/controls';
import { canEdit, useRoleIn } from '../library/shopAccess';
import { space, theme, useBreakpoint } from '../ui';
import { CompareLinks } from './CompareLinks';
import { RegeneratePanel } from './Regenerate';
import { TemplateLinks } from './Templates';
import { undersideModel, UNDERSIDE_LAYERS } from './underside';

type Face = 'top' | 'underside';

export function RevisionPage({ revision, design }: { revision: RevisionWithTitle; design: DesignDetail }) {
  const { isWide } = useBreakpoint();
  const [units, setUnits] = useDisplayUnits();
  const [face, setFace] = useState<Face>('top');
  const role = useRoleIn(design.shopId);
  const editor = canEdit(role);
  const model = useRevisionModel(revision.id);
  const e = revision.summary.extents;

  const drawn = useMemo(() => {
    if (!model.data) return null;
    try {
      const m = model.data as unknown as makerjs.IModel;
      const top = modelLayerPaths(m);
      const hasUnder = top.some((p) => (UNDERSIDE_LAYERS as readonly string[]).includes(p.layer));
      const plate = revision.summary.features?.plate;
      const part = plate ? { width: plate.width, length: plate.height } : { width: e.width, length: e.height };
      const under = hasUnder ? undersideModel(m, part) : null;
      return { top, under: under ? modelLayerPaths(under) : null };
    } catch {
      return null;
    }
  }, [model.data, revision.summary, e.width, e.height]);

  const underFeatures = useMemo(() => {
    const f = revision.summary.features ?? {};
    return Object.fromEntries(Object.entries(f).filter(([k]) => k !== 'pocket'));
  }, [revision.summary]);

  const showing = face === 'underside' && drawn?.under ? drawn.under : drawn?.top;
  const drawing = model.isLoading ? (
    <Loading label={`Drawing r${revision.number}…`} />
  ) : !showing ? (
    <Notice title="The drawing could not be read">{model.error?.message ?? 'The stored geometry for this revision could not be drawn.'}</Notice>
  ) : (
    <View style={{ gap: space.sm }}>
      {drawn?.under ? (
        <View style={{ gap: 4 }}>
          <Segmented<Face>
            label="Face shown"
            options={[
              { value: 'top', label: 'Top face' },
              { value: 'underside', label: 'Underside' },
            ]}
            value={face}
            onChange={setFace}
          />
          {face === 'underside' ? (
            <Text style={theme.muted} testID="underside-note">
              Underside, as cut after turning the plate over about its long axis: recess, cord channel, reliefs and alignment marks are mirrored; the top pocket is not shown.
            </Text>
          ) : null}
        </View>
      ) : null}
      <PanZoomDrawing
        paths={showing}
        extents={{ width: e.width, height: e.height }}
        units={units}
        features={face === 'underside' ? underFeatures : revision.summary.features}
        label={`${revision.designTitle} r${revision.number}, ${face === 'underside' ? 'underside' : 'top face'}`}
        accessibilityLabel={`Drawing of ${revision.designTitle} r${revision.number}, ${face === 'underside' ? 'underside as cut after turning over' : 'top face'}`}
        maxHeight={isWide ? 520 : 420}
        testID="revision-drawing"
      />
    </View>
  );

  const details = (
    <View style={{ gap: space.lg }}>
      <Section title="Fit notes" testID="fit-notes">
        <FitNotesView notes={revision.fitNotes} units={units} />
      </Section>
      <Section title="Geometry" testID="geometry-summary">
        <GeometrySummaryView summary={revision.summary} units={units} />
      </Section>
    </View>
  );

  return (
    <View style={{ gap: space.lg }}>
      <View style={{ gap: space.xs }}>
        <View style={[theme.row, { flexWrap: 'wrap' }]}>
          <Link href={`/designs/${design.id}?r=${revision.number}`} style={theme.link}>
            {design.title}
          </Link>
          <Text style={theme.heading} role="heading">
            r{revision.number}
          </Text>
          <StatusBadge status={revision.status} />
        </View>
        <ShopLine shopName={design.shopName} />
        <Text style={theme.body}>{revision.message}</Text>
        <Text style={theme.muted}>
          {revision.source === 'generated' ? `Generated (${revision.generatorId})` : 'Uploaded file'} · {revision.author?.name ?? 'someone'} · {formatWhen(revision.createdAt, true)}
        </Text>
      </View>
      <UnitsToggle units={units} onChange={setUnits} />
      {isWide ? (
        <View style={{ flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' }}>
          <View style={{ flex: 3, minWidth: 0 }}>{drawing}</View>
          <View style={{ flex: 2, minWidth: 0 }}>{details}</View>
        </View>
      ) : (
        <>
          {drawing}
          {details}
        </>
      )}
      <Section title="Files and printable templates" testID="files">
        <View style={{ gap: space.md }}>
          <TemplateLinks revisionId={revision.id} units={units} />
          <DownloadPanel revision={revision} kind={design.kind} />
        </View>
      </Section>
      {editor && revision.source === 'generated' ? (
        <Section title="Regenerate for another device">
          <RegeneratePanel revisionId={revision.id} designId={design.id} shopId={design.shopId} currentDevice={revision.fitNotes.device?.name} material={revision.fitNotes.stock?.material ?? design.material} units={units} />
        </Section>
      ) : null}
      <Section title="Compare with another revision">
        <CompareLinks revisionId={revision.id} design={design} />
      </Section>
      <Section title="Cut log">
        <CutLog revision={revision} shopId={design.shopId} canRecord={editor} units={units} defaultMaterial={revision.fitNotes.stock?.material ?? design.material} />
      </Section>
    </View>
  );
}
