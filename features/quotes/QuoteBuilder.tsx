import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { layoutQueries } from '../layouts/queries';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useBuildQuote } from './queries';

/** Prices a layout (its working draft or its latest frozen version) into a new version of the quote. */
export function QuoteBuilder({ jobId, hasQuote }: { jobId: string; hasQuote: boolean }) {
  const layouts = useQuery(layoutQueries.job(jobId));
  const build = useBuildQuote(jobId);
  const [chosen, setChosen] = useState<string | null>(null);
  const [source, setSource] = useState<'draft' | 'version'>('draft');
  const list = layouts.data?.layouts ?? [];
  if (list.length === 0) return <Text variant="caption">Start a layout to price it.</Text>;
  const layout = list.find((l) => l.id === chosen) ?? list[0]!;
  const latest = layout.versionCount;
  const buildNow = () => build.mutate({ layoutId: layout.id, ...(source === 'version' && latest > 0 ? { versionNumber: latest } : {}) });
  return (
    <View style={styles.box}>
      {list.length > 1 ? <ChoiceChips label="Layout to price" options={list.map((l) => ({ value: l.id, label: l.name }))} value={layout.id} onChange={setChosen} /> : null}
      {latest > 0 ? (
        <ChoiceChips
          label="Price"
          options={[
            { value: 'draft', label: 'The working draft' },
            { value: 'version', label: `Version ${latest}` },
          ]}
          value={source}
          onChange={setSource}
          testID="quote-source"
        />
      ) : null}
      <Text variant="caption">
        Prices come from the shop's price list and the frame chosen on this job.{hasQuote ? ' A new build is the next version; an unsent draft is replaced.' : ''}
      </Text>
      <Button label={hasQuote ? 'Build a new version' : 'Build quote from layout'} onPress={buildNow} busy={build.isPending} testID="build-quote" />
      {build.isError ? <Notice>{errorMessage(build.error) ?? build.error.message}</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({ box: { gap: space.sm, marginTop: space.sm } });
