// The report of `wetfront anchor`: settings, the per-interval and per-visit tables, warnings and
// cautions.
#pragma once

#include <string>

#include "wetfront/site/anchored_season.hpp"

namespace wetfront::cli {

std::string anchored_report(const site::SiteSetup& site, const site::ParameterStudy& study,
                            const site::AnchoredSeason& season, double seconds, unsigned threads);

}  // namespace wetfront::cli
