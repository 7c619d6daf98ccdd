// The metal whose criteria apply to an asset's surveys: aluminium hulls have their own; all else is steel.
export function protectedMetalOf(asset: { kind: string; hullMaterial?: string | null }): 'steel' | 'aluminium' {
  return asset.kind === 'vessel' && asset.hullMaterial === 'aluminium' ? 'aluminium' : 'steel';
}
