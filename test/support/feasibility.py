# Independent reference for stereoisomer counts: RDKit (Debian python3-rdkit) 3D embedding and MMFF energies,
# and rdCIPLabeler (the new CIP labeller) for labels. Reads a JSON list of tasks on stdin, prints JSON.
#   {"smiles": s, "all": true}  -> every stereoisomer RDKit enumerates: canonical SMILES, embedded?, MMFF energy
# (ETKDG keeps the requested configuration: it enforces chirality while embedding)
#   {"smiles": s}               -> this one structure: embedded?, MMFF energy, CIP labels (atom index -> label)
#   {"smiles": s, "every": true} -> like "all" but over every unit RDKit can flip, drawn or not (unique by canonical
#                                   isomeric SMILES, as EnumerateStereoisomers' unique=True), at most 3 embedding
#                                   attempts per seed (bounded, for cages with many impossible isomers), and the
#                                   number of units RDKit flips (to tell comparable cases apart)
# Embedding is the step StereoEnumerationOptions(tryEmbedding=True) takes, made reproducible: fixed seeds.
import json
import sys

from rdkit import Chem, RDLogger
from rdkit.Chem import AllChem
from rdkit.Chem import rdCIPLabeler
from rdkit.Chem.EnumerateStereoisomers import EnumerateStereoisomers, StereoEnumerationOptions

RDLogger.DisableLog('rdApp.*')


def embed(m, attempts=10):
    mh = Chem.AddHs(m)
    for seed in (1, 7, 42):
        p = AllChem.ETKDGv3()
        p.randomSeed = seed
        p.maxIterations = attempts
        if AllChem.EmbedMolecule(mh, p) == 0:
            props = AllChem.MMFFGetMoleculeProperties(mh)
            if props is None:
                return True, None
            ff = AllChem.MMFFGetMoleculeForceField(mh, props)
            ff.Minimize(maxIts=2000)
            return True, ff.CalcEnergy()
    return False, None


def labels(m):
    rdCIPLabeler.AssignCIPLabels(m)
    out = {}
    for a in m.GetAtoms():
        if a.HasProp('_CIPCode'):
            out[str(a.GetIdx())] = a.GetProp('_CIPCode')
    return out


result = []
for task in json.load(sys.stdin):
    m = Chem.MolFromSmiles(task['smiles'])
    if task.get('every'):
        opts = StereoEnumerationOptions(unique=True, onlyUnassigned=False, maxIsomers=0)
        isomers = {}
        for iso in EnumerateStereoisomers(m, options=opts):
            key = Chem.MolToSmiles(iso)
            if key not in isomers:
                ok, energy = embed(iso, 3)
                isomers[key] = {'smiles': key, 'embedded': ok, 'energy': energy}
        result.append({'units': len(Chem.FindPotentialStereo(m)), 'isomers': list(isomers.values())})
    elif task.get('all'):
        opts = StereoEnumerationOptions(onlyUnassigned=True, unique=True)
        isomers = []
        for iso in EnumerateStereoisomers(m, options=opts):
            ok, energy = embed(iso)
            isomers.append({'smiles': Chem.MolToSmiles(iso), 'embedded': ok, 'energy': energy})
        result.append({'isomers': isomers})
    else:
        ok, energy = embed(m)
        result.append({'embedded': ok, 'energy': energy, 'labels': labels(m)})
print(json.dumps(result))
