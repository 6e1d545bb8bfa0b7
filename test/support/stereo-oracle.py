# Independent reference for stereoisomer counts of rigid polycycles: RDKit (Debian python3-rdkit 2022.09).
# Reads a JSON list of SMILES on stdin; for each prints every stereoisomer RDKit enumerates
# (EnumerateStereoisomers, unique=True, every unit, deduplicated by canonical isomeric SMILES), whether it embeds
# in 3D and its MMFF94 energy, and the number of stereo units RDKit flips (to tell comparable cases apart).
# Embedding is the embedding step of StereoEnumerationOptions(tryEmbedding=True), made reproducible and bounded:
# ETKDGv3 with fixed seeds (1, 7, 42) and at most 3 attempts each (tryEmbedding tries one seed, unbounded).
# ETKDG enforces the requested configuration, so an isomer that never embeds is taken as impossible.
import json
import sys

from rdkit import Chem, RDLogger
from rdkit.Chem import AllChem
from rdkit.Chem.EnumerateStereoisomers import EnumerateStereoisomers, StereoEnumerationOptions

RDLogger.DisableLog('rdApp.*')


def embed(m):
    mh = Chem.AddHs(m)
    for seed in (1, 7, 42):
        p = AllChem.ETKDGv3()
        p.randomSeed = seed
        p.maxIterations = 3
        if AllChem.EmbedMolecule(mh, p) == 0:
            props = AllChem.MMFFGetMoleculeProperties(mh)
            if props is None:
                return True, None
            ff = AllChem.MMFFGetMoleculeForceField(mh, props)
            ff.Minimize(maxIts=2000)
            return True, ff.CalcEnergy()
    return False, None


result = []
for smiles in json.load(sys.stdin):
    m = Chem.MolFromSmiles(smiles)
    opts = StereoEnumerationOptions(unique=True, onlyUnassigned=False, maxIsomers=0)
    isomers = {}
    for iso in EnumerateStereoisomers(m, options=opts):
        key = Chem.MolToSmiles(iso)
        if key not in isomers:
            ok, energy = embed(iso)
            isomers[key] = {'smiles': key, 'embedded': ok, 'energy': energy}
    flips = len(Chem.FindPotentialStereo(m))
    result.append({'units': flips, 'isomers': list(isomers.values())})
print(json.dumps(result))
