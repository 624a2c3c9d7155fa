/** The seller's home: smoke and pets matter to members with allergies, so both are always stated, yes or no. */
export function Disclosures({ smokeFree, petFree }: { smokeFree: boolean; petFree: boolean }) {
  return (
    <ul>
      <li className={smokeFree ? undefined : 'font-semibold text-ochre'}>{smokeFree ? 'Smoke-free home' : 'Not a smoke-free home'}</li>
      <li className={petFree ? undefined : 'font-semibold text-ochre'}>{petFree ? 'Pet-free home' : 'Pets live in the home'}</li>
    </ul>
  );
}
