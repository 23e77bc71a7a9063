// Reservoir readings from a field CSV, grouped by the head they were taken at.
//
// Columns: one naming the head of each reading (e.g. "supply head [cm]"), "time [min]"
// (any time unit), "water level [cm]" (any length unit; the height of water in the
// reservoir on its scale, which falls as water leaves), and "steady" (yes/no: whether the
// crew judged flow steady at this reading). Readings of one head need not be contiguous;
// within a head their times must increase.
#pragma once

#include <string>
#include <vector>

#include "wetfront/base/csv_table.hpp"
#include "wetfront/soils/steady_rate.hpp"

namespace wetfront::site {

struct HeadReadings {
  double head_cm = 0.0;                                  // the grouping value, internal cm
  std::vector<soils::ReservoirReading> steady_readings;  // rows marked steady, in file order
  std::vector<std::size_t> steady_rows;                  // their row indices in the table
  std::size_t all_readings = 0;                          // rows of this head, steady or not
  std::size_t first_row = 0;                             // first row of this head in the table
};

struct HeadOutflow {
  double head_cm = 0.0;
  soils::SteadyOutflow outflow;
  std::size_t all_readings = 0;
};

// Groups the rows by the head column's value, sorted by head ascending.
std::vector<HeadReadings> group_readings(const base::CsvTable& table, const std::string& head_column,
                                         base::Dimension head_dimension);

// Steady outflow of each head; reading errors are reported at their file line.
std::vector<HeadOutflow> steady_outflows(const base::CsvTable& table, const std::vector<HeadReadings>& groups,
                                         double reservoir_area_cm2, const soils::SteadinessTolerances& tolerances);

}  // namespace wetfront::site
