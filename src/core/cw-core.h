#pragma once

/* Umbrella header of the GTK-free core. */
#include "cw-analysis.h"
#include "cw-batch.h"
#include "cw-core-error.h"
#include "cw-couplings.h"
#include "cw-data.h"
#include "cw-document.h"
#include "cw-formula.h"
#include "cw-geometry-data.h"
#include "cw-geometry.h"
#include "cw-groups.h"
#include "cw-interactions.h"
#include "cw-isomers.h"
#include "cw-molecule.h"
#include "cw-reactivity.h"
#include "cw-smiles.h"
#include "cw-thermo.h"
