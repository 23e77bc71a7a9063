// Laboratory data run from CSV files: the core samples of `wetfront soil cores`, the retention
// fit shared by `wetfront soil retention` and `wetfront soil layer`, and the texture classes. File formats are those of
// wetfront/soils/lab_csv.hpp.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "wetfront/site/report_table.hpp"
#include "wetfront/soils/retention_fit.hpp"

namespace wetfront::site {

struct RetentionInputs {
  std::string points_file;   // retention points (suction, water content), or
  std::string cores_file;    // core samples plus
  std::string steps_file;    // suction steps weighed on those cores
  std::string sample;        // fit only this sample; empty: the only sample, or all pooled
  std::string fix_residual;  // text: "0.05", "0.05 cm3/cm3" or "5 %"; empty: fitted
};

struct RetentionReport {
  std::vector<ReportTable> tables;  // the last one lists every fit (written by --csv)
  soils::RetentionParameters chosen;
  std::string provenance;  // which file, sample(s), points, RMSE
  std::vector<std::string> warnings;
};

RetentionReport analyse_retention(const RetentionInputs& inputs);

// `wetfront soil cores`: water content, bulk density and porosity of each ring sample and, with
// the suction steps weighed on them (steps_file not empty), their retention points (the last
// table). Throws base::InputError naming the file.
std::vector<ReportTable> core_tables(const std::string& cores_file, const std::string& steps_file);

// `wetfront soil texture`: the class-average parameters of the texture class `name`, or of every
// class when `name` is empty (Carsel & Parrish 1988). Throws base::InputError for an unknown name.
ReportTable texture_table(const std::string& name);

}  // namespace wetfront::site
