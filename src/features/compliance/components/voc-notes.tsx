/**
 * What every VOC screen says: the limits are the shop's own (nothing is built in), jurisdictions differ,
 * and the air permit and local rules govern. Also the exact conversion factors used.
 */
export function VocLimitsNote({ className }: { className?: string }) {
  return (
    <div className={className}>
      <p>
        <strong>No VOC limit is built into Coatwright.</strong> Limits and caps differ between jurisdictions and air districts, so the
        only ones used here are those the shop enters in Settings. The shop's own air permit and local rules govern; check them, not
        this screen, for what applies. Figures come from the regulatory VOC on each material's record, so they are only as good as the
        maker's technical and safety data sheets they were copied from.
      </p>
    </div>
  );
}

export function VocFactorsNote({ className }: { className?: string }) {
  return (
    <div className={className}>
      <p className="font-semibold">Conversion factors used</p>
      <ul className="mt-1 list-disc pl-5">
        <li>1 lb/gal = 119.826427 g/L (453.59237 g per lb ÷ 3.785411784 L per US gallon)</li>
        <li>1 lb = 0.45359237 kg (so 1 kg = 2.20462262 lb)</li>
        <li>1 US gallon = 3.785411784 L</li>
      </ul>
    </div>
  );
}
