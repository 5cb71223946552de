/** "Amine screen: HL-Ir-7 / HL-Q-3" + "stern-volmer" -> "amine-screen-hl-ir-7-hl-q-3-stern-volmer.png". */
export function figureFileName(studyTitle: string, figure: string): string {
  const base = studyTitle
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80);
  return `${base || 'study'}-${figure}.png`;
}
