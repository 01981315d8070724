import { useEffect, useRef } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { adoptDevicePlans, planKeys } from '../api/plans';

/** Once a member is signed in, the plans this device made before become theirs. Renders nothing. */
export function AdoptDevicePlans({ signedIn }: { signedIn: boolean }) {
  const qc = useQueryClient();
  const done = useRef(false);
  useEffect(() => {
    if (!signedIn || done.current) return;
    done.current = true;
    adoptDevicePlans()
      .then((adopted) => {
        if (adopted.length) void qc.invalidateQueries({ queryKey: planKeys.all });
      })
      .catch(() => {
        // kept on the device: the next sign-in tries again
        done.current = false;
      });
  }, [signedIn, qc]);
  return null;
}
