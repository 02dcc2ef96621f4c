import { Caution } from '@/components/ui/caution';

/** Shown on every treatment screen. */
export function TreatmentCaution() {
  return (
    <Caution title="Treatment caution">
      The product label governs: whether honey supers may be on during a treatment, for how long after, and how to apply
      it safely. Local rules apply. Combtrace only records what the label says; the built-in list of treatment kinds is
      an editable starting point, not advice.
    </Caution>
  );
}
