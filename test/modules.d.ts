// Type stubs for devDependencies that ship without types.
declare module 'commonmark-spec' {
  const spec: { text: string; tests: Array<{ markdown: string; html: string; section: string; number: number }> };
  export default spec;
}
declare module 'chemical-elements' {
  export const elements: Array<{ number: number; symbol: string; mass: number | null; name: string }>;
  export const elementsObject: Record<string, { number: number; symbol: string; mass: number | null; name: string }>;
}
declare module 'periodic-table' {
  export const symbols: Record<
    string,
    {
      atomicNumber: number;
      symbol: string;
      electronegativity: number | '' | null;
      meltingPoint: number | '';
      ionizationEnergy: number | '';
      electronAffinity: number | '';
    }
  >;
}
declare module 'mf-parser' {
  export class MF {
    constructor(mf: string);
    getInfo(): { mass: number; charge: number; mf: string; atoms: Record<string, number> };
  }
}
