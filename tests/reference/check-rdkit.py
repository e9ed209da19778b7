#!/usr/bin/python3
"""Checks Chairwise's SMILES reading and writing against RDKit (Debian python3-rdkit).

Run with /usr/bin/python3 (the system Python that has RDKit):
    check-rdkit.py PROBE SET.smi
PROBE is the built cw-smiles-probe; SET.smi the reference set. For every SMILES of the set:
  1. we read it (no error);
  2. our canonical SMILES, read again, gives the same SMILES (our own round trip);
  3. RDKit's canonical isomeric SMILES of our SMILES equals RDKit's canonical SMILES of the
     input's largest part (salts: the part we keep);
  4. every pair of groups on different ring carbons is cis (same face) for us exactly when it is
     cis on an RDKit 3D embedding (ETKDG) of the input: the face of a group is the side of the
     plane of its carbon's two ring bonds on which its first atom lies;
  5. our molecular formula equals RDKit's CalcMolFormula, and our molar mass is within
     0.05 g/mol of RDKit's MolWt (the two use slightly different tables of atomic weights);
  6. where faces are written, each group's absolute face matches the embedding, "up" being the side
     from which our positions 1 -> 6 run clockwise (the frame of every Chairwise drawing).
Then coverage: every group of the table occurs, and the set has 1,1-, 1,2-, 1,3-, 1,4-, tri- and
tetra-substituted rings, cis and trans. Output is TAP; every check names RDKit and its version.
"""
import json
import subprocess
import sys

try:
    import numpy as np
    from rdkit import Chem, rdBase
    from rdkit.Chem import AllChem, Descriptors, rdMolDescriptors
    from rdkit.Chem.MolStandardize import rdMolStandardize
except ImportError as e:  # the suite must not pass silently without its reference
    print("Bail out! RDKit (python3-rdkit) is not importable with %s: %s" % (sys.executable, e))
    sys.exit(1)

RDKIT = "RDKit %s" % rdBase.rdkitVersion
MASS_TOLERANCE = 0.05  # g/mol

n_test = 0
n_fail = 0


def report(ok, what, detail=""):
    global n_test, n_fail
    n_test += 1
    if not ok:
        n_fail += 1
    print("%s %d - %s%s" % ("ok" if ok else "not ok", n_test, what, "" if ok else " # " + detail))


def largest_part(mol):
    frags = Chem.GetMolFrags(mol, asMols=True)
    return max(frags, key=lambda m: m.GetNumHeavyAtoms()) if len(frags) > 1 else mol, len(frags) > 1


def canonical(smiles):
    m = Chem.MolFromSmiles(smiles)
    if m is None:
        return None
    m, _ = largest_part(m)
    return Chem.MolToSmiles(m, isomericSmiles=True)


def cyclohexane_ring(mol, ring_atoms):
    """The RDKit ring holding our ring carbons, in RDKit's cyclic order."""
    want = set(ring_atoms)
    for ring in mol.GetRingInfo().AtomRings():
        if len(ring) == 6 and want <= set(ring):
            return list(ring)
    return None


def faces_3d(smiles, subs):
    """Face (+1/-1) of each substituent's first atom on a 3D embedding of the input."""
    mol = Chem.AddHs(Chem.MolFromSmiles(smiles))
    params = AllChem.ETKDGv3()
    for seed in (0xC0FFEE, 7, 42, 1234):
        params.randomSeed = seed
        if AllChem.EmbedMolecule(mol, params) == 0:
            break
    else:
        return None
    pos = mol.GetConformer().GetPositions()
    ring = cyclohexane_ring(mol, [s["ring_atom"] for s in subs])
    if ring is None:
        return None
    faces = []
    for s in subs:
        # The two exocyclic bonds of a tetrahedral ring carbon lie on opposite sides of the plane
        # of its two ring bonds, whatever the conformation; the side is read against the local
        # normal (next - C) x (previous - C), which follows the ring's cyclic order everywhere.
        i = ring.index(s["ring_atom"])
        c, nxt, prv = pos[ring[i]], pos[ring[(i + 1) % 6]], pos[ring[i - 1]]
        normal = np.cross(nxt - c, prv - c)
        faces.append(1 if np.dot(pos[s["root_atom"]] - c, normal) > 0 else -1)
    return faces


def absolute_faces_3d(smiles, ring_order, subs):
    """Face (+1 up, -1 down) of each substituent on a 3D embedding, taking "up" as the side from
    which positions 1 -> 6 (our ring order) run clockwise, as in every Chairwise drawing."""
    mol = Chem.AddHs(Chem.MolFromSmiles(smiles))
    params = AllChem.ETKDGv3()
    params.randomSeed = 0xC0FFEE
    if AllChem.EmbedMolecule(mol, params) != 0:
        return None
    pos = mol.GetConformer().GetPositions()
    faces = []
    for s in subs:
        i = ring_order.index(s["ring_atom"])
        c, nxt, prv = pos[ring_order[i]], pos[ring_order[(i + 1) % 6]], pos[ring_order[i - 1]]
        # seen from the up side, prev -> c -> next runs clockwise, so (next - c) x (prev - c)
        # points away from that side
        normal = np.cross(nxt - c, prv - c)
        faces.append(-1 if np.dot(pos[s["root_atom"]] - c, normal) > 0 else 1)
    return faces


def hill_formula(mol):
    # RDKit writes D for [2H] with these flags, and the charge as a trailing +/- (with a count)
    return rdMolDescriptors.CalcMolFormula(mol, True, True)


def normalise_formula(text):
    return text.replace("\u2212", "-")


def ring_pattern(mol, subs):
    ring = cyclohexane_ring(mol, [s["ring_atom"] for s in subs]) if subs else None
    if ring is None:
        return set()
    positions = sorted(ring.index(s["ring_atom"]) for s in subs)
    carbons = sorted(set(positions))
    pattern = set()
    if len(positions) > len(carbons):
        pattern.add("1,1")
    if len(carbons) == 2:
        d = (carbons[1] - carbons[0]) % 6
        pattern.add({1: "1,2", 5: "1,2", 2: "1,3", 4: "1,3", 3: "1,4"}[d])
    elif len(carbons) == 3:
        pattern.add("tri")
    elif len(carbons) >= 4:
        pattern.add("tetra")
    return pattern


def main():
    probe, set_path = sys.argv[1], sys.argv[2]
    lines = []
    with open(set_path, encoding="utf-8") as f:
        for raw in f:
            raw = raw.strip()
            if raw and not raw.startswith("#"):
                lines.append(raw.split()[0])
    groups = [l.split("\t")[0] for l in subprocess.run([probe, "--groups"], check=True, capture_output=True,
                                                         text=True).stdout.splitlines()]
    out = subprocess.run([probe], input="\n".join(lines) + "\n", check=True, capture_output=True, text=True).stdout
    results = [json.loads(l) for l in out.splitlines()]
    with_faces = sum(1 for r in results if r.get("ok", True) and "ring" in r
                     and any(s["face"] is not None for s in r["subs"]))
    print("1..%d" % (len(lines) * 5 + 3 + with_faces))
    print("# reference: %s (Debian python3-rdkit), Python %s" % (RDKIT, sys.version.split()[0]))
    if len(results) != len(lines):
        print("Bail out! the probe answered %d lines for %d SMILES" % (len(results), len(lines)))
        return 1

    seen_groups = set()
    patterns = set()
    configurations = set()
    for smiles, r in zip(lines, results):
        report(r.get("ok"), "%s: read" % smiles, r.get("error", ""))
        if not r.get("ok"):
            for _ in range(4):
                report(False, "%s: skipped after a reading error" % smiles, "not read")
            continue
        seen_groups.update(s["group"] for s in r["subs"])
        configurations.add(r["configuration"])
        mol = Chem.MolFromSmiles(smiles)
        patterns |= ring_pattern(mol, r["subs"])

        report(r["smiles_again"] == r["smiles"], "%s: our SMILES %s reads back to itself" % (smiles, r["smiles"]),
               "second writing %s" % r["smiles_again"])

        theirs, ours = canonical(smiles), canonical(r["smiles"])
        report(theirs is not None and theirs == ours,
               "%s: canonical SMILES equals %s's (%s)" % (smiles, RDKIT, theirs),
               "%s gives %s for our %s" % (RDKIT, ours, r["smiles"]))

        faces = faces_3d(smiles, r["subs"])
        bad = []
        if faces is None:
            bad.append("no 3D embedding")
        else:
            subs = r["subs"]
            for i in range(len(subs)):
                for j in range(i + 1, len(subs)):
                    a, b = subs[i], subs[j]
                    if a["ring_atom"] == b["ring_atom"]:
                        if faces[i] == faces[j]:
                            bad.append("geminal %s/%s on one face in 3D" % (a["group"], b["group"]))
                        continue
                    if a["face"] is None or b["face"] is None:
                        continue
                    if (a["face"] == b["face"]) != (faces[i] == faces[j]):
                        bad.append("%s(atom %d)/%s(atom %d): ours %s, 3D %s" % (
                            a["group"], a["root_atom"], b["group"], b["root_atom"],
                            "cis" if a["face"] == b["face"] else "trans",
                            "cis" if faces[i] == faces[j] else "trans"))
        report(not bad, "%s: cis/trans relations match an %s 3D embedding" % (smiles, RDKIT), "; ".join(bad))

        if "ring" in r and any(s["face"] is not None for s in r["subs"]):
            faces = absolute_faces_3d(smiles, r["ring"], r["subs"])
            wrong = [] if faces is not None else ["no 3D embedding"]
            for s, f in zip(r["subs"], faces or []):
                if s["face"] is not None and (s["face"] == "up") != (f > 0):
                    wrong.append("%s(atom %d): ours %s" % (s["group"], s["root_atom"], s["face"]))
            report(not wrong, "%s: up/down faces (positions clockwise seen from the up face) match "
                   "an %s 3D embedding" % (smiles, RDKIT), "; ".join(wrong))

        part, _ = largest_part(mol)
        f_theirs = hill_formula(part)
        m_theirs = Descriptors.MolWt(part)
        f_ours = normalise_formula(r["formula"])
        ok = f_ours == f_theirs and abs(r["mass"] - m_theirs) <= MASS_TOLERANCE
        report(ok, "%s: formula %s and molar mass %.3f match %s (%s, %.3f)" % (smiles, f_ours, r["mass"], RDKIT,
                                                                             f_theirs, m_theirs),
               "ours %s %.4f, theirs %s %.4f" % (f_ours, r["mass"], f_theirs, m_theirs))

    missing = [g for g in groups if g not in seen_groups]
    report(not missing, "every table group occurs in the set (%d groups)" % len(groups), "missing: %s" % missing)
    need = {"1,1", "1,2", "1,3", "1,4", "tri", "tetra"}
    report(need <= patterns, "the set has 1,1-, 1,2-, 1,3-, 1,4-, tri- and tetra-substitution",
           "missing: %s" % sorted(need - patterns))
    report({"cis", "trans"} <= configurations, "the set has cis and trans isomers", "have %s" % sorted(configurations))
    print("# %d checks, %d failed, against %s" % (n_test, n_fail, RDKIT))
    return 1 if n_fail else 0


if __name__ == "__main__":
    sys.exit(main())
