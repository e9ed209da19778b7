#pragma once

/* Umbrella header of the GTK-free core. */
#include "cw-analysis.h"
#include "cw-core-error.h"
#include "cw-data.h"
#include "cw-document.h"
#include "cw-formula.h"
#include "cw-groups.h"
#include "cw-interactions.h"
#include "cw-molecule.h"
#include "cw-thermo.h"
