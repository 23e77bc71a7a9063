// The update of an anchored season's members at one visit (anchored_season.hpp): the members'
// forecasts of the visit's readings, the ensemble Kalman filter's analysis
// (studies/ensemble_filter.hpp) with localisation in depth, and the analysed heads (and, on
// request, parameters) put back into every member (member_state.hpp).
#pragma once

#include <cstdint>
#include <vector>

#include "ensemble_member.hpp"
#include "visit_readings.hpp"
#include "wetfront/site/anchored_season.hpp"
#include "wetfront/studies/ensemble_filter.hpp"

namespace wetfront::site::detail {

// Numbers of the members still running.
std::vector<std::size_t> complete_members(const std::vector<EnsembleMember>& members);

class VisitAnalysis {
 public:
  VisitAnalysis(const EnsembleSite& shared, const AnchorSettings& settings, std::vector<double> cell_centres_cm)
      : shared_(shared), settings_(settings), centres_(std::move(cell_centres_cm)) {}

  // Updates every complete member's heads (and parameters, on request) from the visit's
  // readings; `step` numbers the visit for the perturbed readings' seeds. A member whose updated
  // parameters are not physical stops (EnsembleMember::complete). The returned update has the
  // readings with their forecast and analysis means; stored_water_increment_cm is NaN until the
  // next stretch books it.
  VisitUpdate analyse(std::vector<EnsembleMember>& members, const ReadingsAtVisit& visit, std::uint64_t step) const;

 private:
  studies::Localisation localisation(const ReadingsAtVisit& visit, Eigen::Index rows) const;
  void apply(EnsembleMember& m, const Eigen::VectorXd& analysed, Eigen::Index n_cells) const;

  const EnsembleSite& shared_;
  const AnchorSettings& settings_;
  std::vector<double> centres_;
};

}  // namespace wetfront::site::detail
