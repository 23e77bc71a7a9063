// Cell-centred finite-volume grid of a vertical column. Depths in cm, positive downward;
// face 0 is the soil surface, face N the column bottom.
#pragma once

#include <cstddef>
#include <span>
#include <vector>

namespace wetfront::solver {

class Grid {
 public:
  // face_depths_cm: 0 first, strictly increasing. Throws std::invalid_argument otherwise.
  explicit Grid(std::vector<double> face_depths_cm);

  std::size_t cell_count() const { return faces_.size() - 1; }
  std::span<const double> face_depths_cm() const { return faces_; }
  std::span<const double> cell_depths_cm() const { return centres_; }
  double cell_thickness_cm(std::size_t cell) const { return faces_[cell + 1] - faces_[cell]; }
  double total_depth_cm() const { return faces_.back(); }
  // Index of the face at this depth (within 1e-9 cm), or throws std::invalid_argument.
  std::size_t face_at(double depth_cm) const;

 private:
  std::vector<double> faces_;
  std::vector<double> centres_;
};

Grid uniform_grid(double depth_cm, std::size_t cells);

// A non-uniform grid: faces on every required depth (layer boundaries, sensor depths,
// recharge planes), cells no thicker than surface_cell_cm at the surface, growing by at most
// growth_factor from one cell to the next, and never thicker than max_cell_cm.
struct GridRequest {
  double depth_cm = 0;
  std::vector<double> required_face_depths_cm;
  double surface_cell_cm = 0.5;
  double growth_factor = 1.1;
  double max_cell_cm = 2.0;
  // Each cell of the grid so built is then cut into this many equal cells: 2 gives exactly
  // half the cell size everywhere (a refinement check), with the same kept faces and grading.
  int cell_split = 1;
};
Grid graded_grid(const GridRequest& request);

}  // namespace wetfront::solver
