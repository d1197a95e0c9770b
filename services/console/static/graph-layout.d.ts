// Types of graph-layout.js for the TypeScript tests (the console itself is plain JavaScript, no build step).
export function spreadAngles(angles: number[], gap: number): number[];
export function spreadLine(values: number[], gap: number): number[];

export interface NetworkAnswer {
  counterparty: { id: number; canonicalName: string };
  contracts: { contractId: number; externalId: string; title: string | null; roles: string[] }[];
  parties: { contractId: number; role: string | null; counterpartyId: number | null; ownEntityId: number | null; name: string }[];
  relations?: { fromCounterpartyId: number; toCounterpartyId: number; type: string; relatedCounterpartyId?: number; relatedCanonicalName?: string }[];
}

export interface LaidOutNode {
  key: string;
  kind: 'self' | 'contract' | 'counterparty' | 'own';
  id: number | null;
  label: string;
  detail?: string;
  x: number;
  y: number;
  href?: string;
  labelAt?: 'below' | 'left' | 'right';
}

export function layoutNetwork(
  network: NetworkAnswer,
  options?: { width?: number; height?: number; maxContracts?: number; labelRoom?: number; radialUpTo?: number },
): {
  nodes: LaidOutNode[];
  edges: { from: string; to: string; kind: 'party' | 'relation'; label: string }[];
  bounds: { x: number; y: number; width: number; height: number };
  width: number;
  height: number;
  shownContracts: number;
  totalContracts: number;
};
