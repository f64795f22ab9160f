import { Alert } from '@/components/ui/alert';

/** Said wherever findings are shown (product.md, Cautions). */
export function ScreeningCaution() {
  return (
    <Alert tone="warning" title="Screening aids the reviewer; it does not decide the physics" data-testid="screening-caution">
      A flagged imaginary mode may be a real instability (a soft mode, a phase transition) that belongs in the spectrum.
      Read each finding against the calculation before acting on it.
    </Alert>
  );
}
