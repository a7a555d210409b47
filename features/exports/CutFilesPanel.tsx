import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { parseLayout } from '../../geometry/layout';
import { checkLayout } from '../../geometry/checks';
import type { LengthRounding } from '../../geometry/units';
import { BlockingFindings } from './BlockingFindings';
import { CutApprovalGate } from './CutApprovalGate';
import { ApiError } from '../api/client';
import { layoutQueries } from '../layouts/queries';
import { settingsQueries } from '../settings/queries';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { DownloadLink } from './DownloadLink';
import { cutFilePath, cutSheetPath, type CutFileFormat } from './schema';

interface Props {
  layoutId: string;
  versionNumber: number;
}

const FORMATS = [
  { value: 'dxf', label: 'DXF' },
  { value: 'svg', label: 'SVG' },
] as const;

/** The boards a version cuts, top mat first, then the mounting board when it is cut. */
function boardNames(document: unknown): string[] {
  const parsed = parseLayout(document);
  if (!parsed.ok) return [];
  const mats = parsed.layout.mats.map((m, i) => `Mat ${i + 1} · ${m.name}`);
  return parsed.layout.mountingBoard.cut ? [...mats, 'Mounting board'] : mats;
}

/** The same checks the server runs before writing a file: a version with errors gets no download links. */
function versionBlockers(document: unknown, rounding: LengthRounding) {
  const parsed = parseLayout(document);
  if (!parsed.ok) return [];
  return checkLayout(parsed.layout, { rounding }).filter((f) => f.severity === 'error');
}

function failure(error: unknown): string {
  return error instanceof ApiError ? error.message : 'The cut files could not be prepared.';
}

/** Cut files of one frozen version: pick a format and a cutter profile, then download per mat or all at once. */
export function CutFilesPanel({ layoutId, versionNumber }: Props) {
  const settings = useQuery(settingsQueries.shop());
  const version = useQuery(layoutQueries.version(layoutId, versionNumber));
  const [format, setFormat] = useState<CutFileFormat>('dxf');
  const [chosenProfile, setProfile] = useState<string | null>(null);

  if (settings.error || version.error) return <Notice title="Cut files">{failure(settings.error ?? version.error)}</Notice>;
  if (!settings.data || !version.data) return <Text variant="caption">Preparing cut files…</Text>;

  const profiles = settings.data.settings.cutterProfiles;
  if (profiles.length === 0) return <Notice title="Cut files">Add a cutter profile in the shop settings before exporting.</Notice>;
  const profile = profiles.find((p) => p.id === chosenProfile) ?? profiles[0]!;
  const boards = boardNames(version.data.version.document);
  const link = (mat: string) => cutFilePath(layoutId, versionNumber, { format, profile: profile.id, mat });
  const blockers = versionBlockers(version.data.version.document, settings.data.settings.rounding);
  if (blockers.length > 0) {
    return (
      <View style={styles.panel} testID="cut-files">
        <Text variant="heading">Cut files · version {versionNumber}</Text>
        <BlockingFindings title="No cut file: fix these in the draft and freeze a new version" findings={blockers} testID="export-blockers" />
      </View>
    );
  }

  return (
    <View style={styles.panel} testID="cut-files">
      <Text variant="heading">Cut files · version {versionNumber}</Text>
      <ChoiceChips label="Format" options={FORMATS} value={format} onChange={setFormat} testID="cut-format" />
      <ChoiceChips label="Cutter" options={profiles.map((p) => ({ value: p.id, label: p.name }))} value={profile.id} onChange={setProfile} testID="cut-profile" />
      <Text variant="caption">
        {profile.units === 'mm' ? 'Millimetres' : 'Inches'}, {profile.mirrored ? 'mirrored for face-down cutting' : 'face up'}, following the{' '}
        {profile.pathEdge} edge, {profile.arcs ? 'true arcs' : 'straight segments only'}.
      </Text>
      <CutApprovalGate layoutId={layoutId} versionNumber={versionNumber}>
        <View style={styles.links}>
          {boards.map((name, i) => (
            <DownloadLink key={name} href={link(String(i + 1))} label={`${name} (.${format})`} mode="download" testID={`cut-file-${i + 1}`} />
          ))}
          {profile.filePerMat ? null : <DownloadLink href={link('all')} label={`All mats in one file (.${format})`} mode="download" testID="cut-file-all" />}
        </View>
        <DownloadLink href={cutSheetPath(layoutId, versionNumber, profile.id)} label="Printable cut sheet" mode="open" testID="cut-sheet" />
      </CutApprovalGate>
      <Text variant="caption">Cut a test opening on scrap board after changing blades or profiles; keep hands clear of the cutting head.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.md, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.card },
  links: { gap: space.sm },
});
