import type { ReactNode } from 'react';
import { FormMessage } from '../../../components/ui/form-message';

/** Shown instead of a form when an e-mailed link arrives without a usable token. */
export function LinkProblem({ children }: { children: ReactNode }) {
  return (
    <FormMessage tone="error" title="This link cannot be used">
      {children}
    </FormMessage>
  );
}
