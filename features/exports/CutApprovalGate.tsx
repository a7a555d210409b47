import { useQuery } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { authQueries } from '../auth/queries';
import { layoutQueries } from '../layouts/queries';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { cutApprovalQueries, useReleaseForCutting } from './queries';
import { cutApprovalText } from './schema';

interface Props {
  layoutId: string;
  versionNumber: number;
  /** The download links, shown only once the version may be cut. */
  children: ReactNode;
}

/**
 * Cut files come only from what the customer approved on a proof. Otherwise the panel says which
 * version was approved, and an owner can release this one with a reason (logged, printed on the cut sheet).
 */
export function CutApprovalGate({ layoutId, versionNumber, children }: Props) {
  const approval = useQuery(cutApprovalQueries.version(layoutId, versionNumber));
  if (approval.isPending) return <Text variant="caption">Checking the customer's approval…</Text>;
  if (approval.isError) return <Notice title="Cut files">{errorMessage(approval.error) ?? 'The approval could not be read.'}</Notice>;
  const { approval: given, approvedVersion } = approval.data;
  if (given) {
    return (
      <View style={styles.box}>
        <Text variant="caption" testID="cut-approval">{cutApprovalText(given)}</Text>
        {children}
      </View>
    );
  }
  return (
    <View style={styles.box} testID="cut-not-approved">
      <Notice title="Not approved for cutting">
        {`The customer has not approved version ${versionNumber} on a proof, so it has no cut files.${
          approvedVersion ? ` They approved version ${approvedVersion}: cut that one.` : ' Send a proof from the job page and wait for the answer.'
        }`}
      </Notice>
      <ReleaseForm layoutId={layoutId} versionNumber={versionNumber} />
    </View>
  );
}

/** Owners only: cut anyway, with the reason on record. */
function ReleaseForm({ layoutId, versionNumber }: { layoutId: string; versionNumber: number }) {
  const me = useQuery(authQueries.me());
  const layout = useQuery(layoutQueries.detail(layoutId));
  const release = useReleaseForCutting(layoutId, versionNumber, layout.data?.layout.jobId);
  const [reason, setReason] = useState('');
  if (me.data?.member.role !== 'owner') return <Text variant="caption">An owner can release this version for cutting with a reason.</Text>;
  return (
    <View style={styles.box}>
      <TextField
        label="Reason to cut without the customer's approval"
        value={reason}
        onChangeText={setReason}
        testID="release-reason"
        error={release.isError ? errorMessage(release.error) : undefined}
      />
      <Text variant="caption">The reason is kept in the job's activity and printed on the cut sheet.</Text>
      <Button label={`Release version ${versionNumber} for cutting`} kind="quiet" busy={release.isPending} disabled={!reason.trim()} onPress={() => release.mutate(reason.trim())} testID="release-confirm" />
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
});
