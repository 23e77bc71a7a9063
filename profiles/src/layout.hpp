// Names and descriptions shared by the run-file writer and reader (docs/hdf5-layout.md).
#pragma once

#include <array>
#include <string_view>

#include "wetfront/profiles/visit_balance.hpp"
#include "wetfront/solver/column_run.hpp"

namespace wetfront::profiles::layout {

inline constexpr std::string_view kSignConvention =
    "Depths are positive downward from the soil surface. Fluxes are positive downward "
    "(infiltration, drainage and recharge positive; capillary rise negative). Evaporation and "
    "transpiration are positive amounts of water leaving the soil.";

// A cumulative balance term: dataset name in /balance, member, long name.
struct CumulativeTerm {
  std::string_view name;
  double solver::CumulativeBalance::*member;
  std::string_view long_name;
};

inline constexpr std::array<CumulativeTerm, 10> kCumulativeTerms{{
    {"water_input", &solver::CumulativeBalance::water_input_cm,
     "rain and irrigation reaching the surface since the run start"},
    {"potential_evaporation", &solver::CumulativeBalance::potential_evaporation_cm,
     "potential evaporation since the run start"},
    {"actual_evaporation", &solver::CumulativeBalance::actual_evaporation_cm,
     "evaporation from the soil surface since the run start (positive leaving the soil)"},
    {"runoff", &solver::CumulativeBalance::runoff_cm, "surface runoff since the run start"},
    {"infiltration", &solver::CumulativeBalance::infiltration_cm,
     "net flow across the soil surface since the run start (positive downward)"},
    {"transpiration", &solver::CumulativeBalance::transpiration_cm,
     "root water uptake since the run start (positive leaving the soil)"},
    {"bottom_flux", &solver::CumulativeBalance::bottom_flux_cm,
     "flow across the column bottom since the run start (positive downward, out of the column)"},
    {"ponded_depth", &solver::CumulativeBalance::ponded_depth_cm, "water held on the soil surface"},
    {"soil_storage", &solver::CumulativeBalance::soil_storage_cm, "water stored in the soil column"},
    {"balance_error", &solver::CumulativeBalance::balance_error_cm,
     "storage change minus (infiltration - transpiration - bottom flux) since the run start"},
}};

struct IntervalTerm {
  std::string_view name;
  double IntervalBalance::*member;
  std::string_view long_name;
};

inline constexpr std::array<IntervalTerm, 10> kIntervalTerms{{
    {"water_input", &IntervalBalance::water_input_cm, "rain and irrigation reaching the surface in the interval"},
    {"potential_evaporation", &IntervalBalance::potential_evaporation_cm, "potential evaporation in the interval"},
    {"actual_evaporation", &IntervalBalance::actual_evaporation_cm,
     "evaporation from the soil surface in the interval (positive leaving the soil)"},
    {"runoff", &IntervalBalance::runoff_cm, "surface runoff in the interval"},
    {"infiltration", &IntervalBalance::infiltration_cm,
     "net flow across the soil surface in the interval (positive downward)"},
    {"transpiration", &IntervalBalance::transpiration_cm,
     "root water uptake in the interval (positive leaving the soil)"},
    {"bottom_flux", &IntervalBalance::bottom_flux_cm,
     "flow across the column bottom in the interval (positive downward, out of the column)"},
    {"ponded_change", &IntervalBalance::ponded_change_cm, "change of the water held on the surface over the interval"},
    {"storage_change", &IntervalBalance::storage_change_cm, "change of the water stored in the soil over the interval"},
    {"balance_error_change", &IntervalBalance::balance_error_change_cm,
     "change of the cumulative balance error over the interval"},
}};

// Per-cell profile datasets in /profiles: name, member, units, long name.
struct ProfileField {
  std::string_view name;
  std::vector<double> solver::ProfileSnapshot::*member;
  std::string_view units;
  std::string_view long_name;
};

inline const std::array<ProfileField, 4> kCellFields{{
    {"pressure_head", &solver::ProfileSnapshot::head_cm, "cm", "pressure head at the cell centre"},
    {"water_content", &solver::ProfileSnapshot::water_content, "cm3/cm3", "volumetric water content of the cell"},
    {"conductivity", &solver::ProfileSnapshot::conductivity_cm_per_d, "cm/d",
     "unsaturated hydraulic conductivity at the cell centre"},
    {"sink_rate", &solver::ProfileSnapshot::sink_rate_per_day, "1/d",
     "root water uptake per unit soil volume (positive leaving the soil)"},
}};

}  // namespace wetfront::profiles::layout
