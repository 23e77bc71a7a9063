#include "wetfront/solver/grid.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

namespace wetfront::solver {

Grid::Grid(std::vector<double> face_depths_cm) : faces_(std::move(face_depths_cm)) {
  if (faces_.size() < 2 || faces_.front() != 0.0)
    throw std::invalid_argument("a grid needs at least two face depths, the first at 0 cm");
  for (std::size_t i = 1; i < faces_.size(); ++i) {
    if (!(faces_[i] > faces_[i - 1]))
      throw std::invalid_argument(
          fmt::format("grid face depths must increase: face {} at {} cm follows {} cm", i, faces_[i], faces_[i - 1]));
  }
  centres_.resize(faces_.size() - 1);
  for (std::size_t i = 0; i + 1 < faces_.size(); ++i) centres_[i] = 0.5 * (faces_[i] + faces_[i + 1]);
}

std::size_t Grid::face_at(double depth_cm) const {
  const auto it = std::lower_bound(faces_.begin(), faces_.end(), depth_cm - 1e-9);
  if (it == faces_.end() || std::abs(*it - depth_cm) > 1e-9)
    throw std::invalid_argument(fmt::format("no grid face at {} cm", depth_cm));
  return static_cast<std::size_t>(it - faces_.begin());
}

Grid uniform_grid(double depth_cm, std::size_t cells) {
  if (cells == 0 || !(depth_cm > 0)) throw std::invalid_argument("a uniform grid needs a positive depth and cells");
  std::vector<double> faces(cells + 1);
  for (std::size_t i = 0; i <= cells; ++i) faces[i] = depth_cm * static_cast<double>(i) / static_cast<double>(cells);
  return Grid(std::move(faces));
}

// Fills [top, bottom] with cells that start at thickness `first`, grow by at most `growth`
// and never exceed `largest`; the last cell is matched to the interval by rescaling.
static void fill_interval(double top, double bottom, double first, double growth, double largest,
                          std::vector<double>& faces) {
  std::vector<double> widths;
  double width = std::min(first, largest);
  double covered = 0.0;
  while (covered + width < bottom - top) {
    widths.push_back(width);
    covered += width;
    width = std::min(width * growth, largest);
  }
  widths.push_back(bottom - top - covered);
  // Merge a sliver last cell into its neighbour, then spread the interval evenly over the cells.
  if (widths.size() > 1 && widths.back() < 0.5 * widths[widths.size() - 2]) {
    widths[widths.size() - 2] += widths.back();
    widths.pop_back();
  }
  double depth = top;
  for (double w : widths) {
    depth += w;
    faces.push_back(depth);
  }
  faces.back() = bottom;
}

Grid graded_grid(const GridRequest& request) {
  if (!(request.depth_cm > 0)) throw std::invalid_argument("grid depth must be positive");
  if (!(request.surface_cell_cm > 0) || !(request.growth_factor >= 1.0) || !(request.max_cell_cm > 0))
    throw std::invalid_argument("grid: surface cell and largest cell must be positive, growth factor >= 1");
  std::vector<double> anchors = {0.0, request.depth_cm};
  for (double d : request.required_face_depths_cm) {
    if (d < 0 || d > request.depth_cm)
      throw std::invalid_argument(fmt::format("required grid face at {} cm lies outside the column (0 to {} cm)", d,
                                              request.depth_cm));
    anchors.push_back(d);
  }
  std::sort(anchors.begin(), anchors.end());
  anchors.erase(std::unique(anchors.begin(), anchors.end(), [](double a, double b) { return std::abs(a - b) < 1e-9; }),
                anchors.end());
  std::vector<double> faces = {0.0};
  for (std::size_t k = 1; k < anchors.size(); ++k) {
    // Cell size allowed at this depth by growth from the surface cell.
    const double top = anchors[k - 1];
    const double last = faces.size() > 1 ? faces.back() - faces[faces.size() - 2] : request.surface_cell_cm;
    const double first = faces.size() > 1 ? std::min(last * request.growth_factor, request.max_cell_cm)
                                           : request.surface_cell_cm;
    fill_interval(top, anchors[k], first, request.growth_factor, request.max_cell_cm, faces);
  }
  return Grid(std::move(faces));
}

}  // namespace wetfront::solver
