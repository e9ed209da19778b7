#!/usr/bin/python3
"""Outside check of chairwise-calc's 3D chairs against RDKit (used only in tests).

Reads an XYZ file written by `chairwise-calc geometry` for equatorial methylcyclohexane,
checks that RDKit perceives the expected connectivity from the coordinates, and compares the
ring torsions and the H-C3-C4-H torsions (far from the methyl) with an MMFF94-optimised
cyclohexane chair from RDKit (the lowest of 20 embedded conformers). Our chair uses the
electron-diffraction C-C-C angle and an ideal tetrahedral H-C-H angle, MMFF its own: we allow 3°.
Prints one TAP line per check, numbered from argv[2]; exit 0.
"""
import sys

from rdkit import Chem
from rdkit.Chem import AllChem
from rdkit.Chem import rdMolTransforms as T

path, n = sys.argv[1], int(sys.argv[2])
ok = True


def report(name, good, detail=""):
    global n, ok
    n += 1
    print(("ok %d - %s" if good else "not ok %d - %s") % (n, name) + (" (%s)" % detail if detail else ""))
    ok = ok and good


ours = Chem.RWMol(Chem.MolFromXYZFile(path))
# Bonds by distance: within 1.3 × the sum of RDKit's covalent radii (this RDKit lacks rdDetermineBonds).
pt = Chem.GetPeriodicTable()
conf = ours.GetConformer()
for i in range(ours.GetNumAtoms()):
    for k in range(i + 1, ours.GetNumAtoms()):
        d = (conf.GetAtomPosition(i) - conf.GetAtomPosition(k)).Length()
        ri_, rk = (pt.GetRcovalent(ours.GetAtomWithIdx(x).GetAtomicNum()) for x in (i, k))
        if d <= 1.3 * (ri_ + rk):
            ours.AddBond(i, k, Chem.BondType.SINGLE)
Chem.FastFindRings(ours)
ri = ours.GetRingInfo()
report("RDKit sees one six-membered carbon ring", ri.NumRings() == 1 and len(ri.AtomRings()[0]) == 6)
report("RDKit sees 18 atoms, each ring carbon with four neighbours",
       ours.GetNumAtoms() == 18 and all(ours.GetAtomWithIdx(i).GetDegree() == 4 for i in ri.AtomRings()[0]))

ref = Chem.AddHs(Chem.MolFromSmiles("C1CCCCC1"))
cids = list(AllChem.EmbedMultipleConfs(ref, 20, randomSeed=7))
energies = AllChem.MMFFOptimizeMoleculeConfs(ref, maxIters=2000)
conf_ref = ref.GetConformer(cids[min(range(len(cids)), key=lambda i: energies[i][1])])


def ring_torsions(mol, conf, ring):
    return sorted(abs(T.GetDihedralDeg(conf, ring[i], ring[(i + 1) % 6], ring[(i + 2) % 6], ring[(i + 3) % 6]))
                  for i in range(6))


def hcch(mol, conf, a, b):
    ha = [x.GetIdx() for x in mol.GetAtomWithIdx(a).GetNeighbors() if x.GetAtomicNum() == 1]
    hb = [x.GetIdx() for x in mol.GetAtomWithIdx(b).GetNeighbors() if x.GetAtomicNum() == 1]
    return sorted(abs(T.GetDihedralDeg(conf, x, a, b, y)) for x in ha for y in hb)


ring_ours = [0, 1, 2, 3, 4, 5]  # our XYZ lists ring carbons 1..6 first
t_ours = ring_torsions(ours, ours.GetConformer(), ring_ours)
t_ref = ring_torsions(ref, conf_ref, [0, 1, 2, 3, 4, 5])
report("ring torsions within 3° of MMFF94", max(abs(a - b) for a, b in zip(t_ours, t_ref)) <= 3.0,
       "ours %.1f, MMFF %.1f" % (t_ours[0], t_ref[0]))
h_ours = hcch(ours, ours.GetConformer(), 2, 3)  # C3-C4
h_ref = hcch(ref, conf_ref, 0, 1)
report("H-C-C-H torsions (ax/eq, eq/eq, ax/ax) within 3° of MMFF94",
       len(h_ours) == 4 and max(abs(a - b) for a, b in zip(h_ours, h_ref)) <= 3.0,
       "ours %s, MMFF %s" % ([round(x, 1) for x in h_ours], [round(x, 1) for x in h_ref]))
sys.exit(0)
