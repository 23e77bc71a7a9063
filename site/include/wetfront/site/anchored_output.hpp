// The tables and the file of an anchored season (anchored_season.hpp). Amounts in the tables are
// in mm (as in the season report); the file keeps cm (docs/hdf5-layout.md, "Anchored season
// files").
#pragma once

#include <filesystem>
#include <string>

#include "wetfront/site/anchored_season.hpp"
#include "wetfront/site/report_table.hpp"

namespace wetfront::site {

// Per visit interval: drainage at the recharge plane of the free run and of the anchored
// ensemble (mean and central 90 % band), the Darcy and water-table estimates where the site has
// them, and the mean water the updates added.
ReportTable anchored_interval_table(const AnchoredSeason& season);

// Per visit with readings: the readings used, innovation (reading minus forecast mean) and
// forecast spread per quantity, and the stored water the update added (mean and 90 % band).
ReportTable anchored_visit_table(const AnchoredSeason& season);

// The study file: root attributes as every study file, /parameters, /intervals (with every
// member's drainage and update), /visits, /readings and /members. Throws base::InputError naming
// the file when it cannot be written.
void write_anchored_file(const std::filesystem::path& path, const SiteSetup& site, const ParameterStudy& study,
                         const AnchoredSeason& season, const std::string& program_version,
                         const std::string& run_id = {});

}  // namespace wetfront::site
