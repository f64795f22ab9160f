/** The screening checks and their thresholds in words, for the group settings page. */
export const CHECK_WORDS: Record<string, { title: string; what: string }> = {
  imaginaryModes: { title: 'Imaginary modes', what: 'Frequencies below zero: an instability, or a supercell or convergence problem.' },
  acousticGamma: { title: 'Acoustic branches at Γ', what: 'The three lowest branches should reach zero at Γ (acoustic sum rule).' },
  continuity: { title: 'Continuity', what: 'Jumps where path segments meet and steps inside a segment.' },
  zoneFolding: { title: 'Zone folding', what: 'q-points given outside the first Brillouin zone.' },
  branchCount: { title: 'Branch count', what: 'The same number of branches at every q-point, a multiple of 3.' },
  pathLabels: { title: 'Path labels', what: 'Labelled high-symmetry points sit where the lattice puts them.' },
  unitsSuspect: { title: 'Suspect units', what: 'A largest frequency out of range, or acoustic branches that grow like ω².' },
};

export const THRESHOLD_WORDS: Record<string, Record<string, { label: string; unit?: string }>> = {
  imaginaryModes: {
    threshold: { label: 'Imaginary when ω is below minus this', unit: 'THz' },
    nearGammaFraction: { label: '"Near Γ" within this fraction of the way from Γ (of the segment on a path, to the zone boundary on a mesh)' },
    nearGammaDepth: { label: 'Near-Γ dip deeper than this fails (shallower warns)', unit: 'THz' },
  },
  acousticGamma: {
    warn: { label: 'Warn above', unit: 'THz' },
    fail: { label: 'Fail above', unit: 'THz' },
  },
  continuity: {
    minDelta: { label: 'Smallest join tolerance', unit: 'THz' },
    relativeDelta: { label: 'Join tolerance as a fraction of the largest |ω|' },
    coincidence: { label: 'Folded q-points closer than this are the same (fractional)' },
    minStep: { label: 'In-segment step flagged above', unit: 'THz' },
    medianFactor: { label: '… and above this many median steps' },
  },
  pathLabels: {
    tolerance: { label: 'Relative tolerance on |q| of a label' },
    latticeTolerance: { label: 'Relative tolerance when recognising the lattice' },
  },
  unitsSuspect: {
    maxTHz: { label: 'Suspect above', unit: 'THz' },
    minTHz: { label: 'Suspect below', unit: 'THz' },
    plausibleLow: { label: 'Plausible range, low end', unit: 'THz' },
    plausibleHigh: { label: 'Plausible range, high end', unit: 'THz' },
    fitFrom: { label: 'ω² fit window starts (fraction from Γ)' },
    fitTo: { label: 'ω² fit window ends (fraction from Γ)' },
    minFitPoints: { label: 'Fewest points in the fit' },
    squaredExponent: { label: 'Exponent above which ω² is suspected' },
  },
};
