import { useQuery } from '@tanstack/react-query';
import { useLocalSearchParams } from 'expo-router';
import { useMemo } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { parseLayout } from '../../geometry/layout';
import { authQueries } from '../auth/queries';
import { layoutQueries } from '../layouts/queries';
import { withShopCheckLimits } from '../layouts/starter';
import { settingsQueries } from '../settings/queries';
import { Notice } from '../ui/Notice';
import { colors, space } from '../ui/theme';
import { DesignerWorkspace } from './DesignerWorkspace';
import { usePreparedEngine } from './usePreparedEngine';

/** Opens one layout in the designer once the layout, the shop's settings and the member's role are known. */
export function DesignerScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const detail = useQuery({ ...layoutQueries.detail(id), refetchOnWindowFocus: false });
  const settings = useQuery(settingsQueries.shop());
  const me = useQuery(authQueries.me());

  // Read once per answer, not on every render (the settings or the member read again keep the same layout).
  const detailData = detail.data;
  const settingsData = settings.data;
  const parsed = useMemo(() => (detailData ? parseLayout(detailData.layout.draft) : null), [detailData]);
  const initial = useMemo(() => (parsed?.ok && settingsData ? withShopCheckLimits(parsed.layout, settingsData.settings) : null), [parsed, settingsData]);
  const engine = usePreparedEngine(id, initial);

  const failed = detail.error ?? settings.error ?? me.error;
  if (failed) {
    return (
      <View style={styles.center}>
        <Notice title="This layout could not be opened">{failed.message}</Notice>
      </View>
    );
  }
  if (parsed && !parsed.ok) {
    return (
      <View style={styles.center}>
        <Notice title="The saved layout cannot be read">{parsed.issues.map((i) => `${i.path || 'layout'}: ${i.message}`).join('; ')}</Notice>
      </View>
    );
  }
  // The wheel stays until the lines of every opening are worked out (usePreparedEngine).
  if (!detail.data || !settings.data || !me.data || !initial || !engine) return <ActivityIndicator color={colors.accent} style={styles.loading} />;

  const editable = me.data.member.role !== 'front_desk';
  return <DesignerWorkspace key={id} detail={detail.data} initial={initial} settings={settings.data.settings} editable={editable} engine={engine} />;
}

const styles = StyleSheet.create({
  loading: { marginTop: space.xxl },
  center: { flex: 1, padding: space.xl, backgroundColor: colors.paper },
});
