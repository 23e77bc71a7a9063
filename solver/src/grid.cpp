#include "wetfront/solver/grid.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
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

namespace {

// The largest cell allowed at depth z:
//   s(z) = min( M, s0 + lambda z, min over intervals a of (L_a + lambda dist(z, a)) ),
// with lambda = (g - 1) / g, M the largest cell, s0 the surface cell, g the growth factor and L_a
// the length of the interval a between two required faces. A field whose slope is at most
// lambda changes by at most a factor exp(lambda) < g over one cell that holds a unit share of
// the integral of dz / s, in either direction (exp(-lambda) > 1 / g), so cells placed by that
// integral grow and shrink within the growth factor.
class SizeField {
 public:
  SizeField(const GridRequest& r, const std::vector<double>& anchors)
      : surface_(std::min(r.surface_cell_cm, r.max_cell_cm)),
        largest_(r.max_cell_cm),
        slope_((r.growth_factor - 1.0) / r.growth_factor),
        anchors_(anchors) {}

  double at(double z) const {
    double s = std::min(largest_, surface_ + slope_ * z);
    for (std::size_t a = 0; a + 1 < anchors_.size(); ++a) {
      const double distance = std::max({0.0, anchors_[a] - z, z - anchors_[a + 1]});
      s = std::min(s, anchors_[a + 1] - anchors_[a] + slope_ * distance);
    }
    return s;
  }

 private:
  double surface_, largest_, slope_;
  const std::vector<double>& anchors_;
};

// The integral of dz / s from `top` down, on a fine subdivision (trapezoid rule): computed once
// per interval between required faces, whatever number of cells the interval gets.
struct CellCountIntegral {
  std::vector<double> depth, cumulative;

  CellCountIntegral(const SizeField& field, double top, double bottom) {
    constexpr std::size_t samples = 4000;
    depth.resize(samples + 1);
    cumulative.assign(samples + 1, 0.0);
    for (std::size_t k = 0; k <= samples; ++k) depth[k] = top + (bottom - top) * static_cast<double>(k) / samples;
    double previous = 1.0 / field.at(depth[0]);
    for (std::size_t k = 1; k <= samples; ++k) {
      const double current = 1.0 / field.at(depth[k]);
      cumulative[k] = cumulative[k - 1] + 0.5 * (depth[k] - depth[k - 1]) * (previous + current);
      previous = current;
    }
  }
  double total() const { return cumulative.back(); }

  // Faces strictly inside the interval for `cells` cells that each hold the same share of the
  // integral (inverted linearly between samples).
  std::vector<double> interior_faces(std::size_t cells) const {
    std::vector<double> faces;
    std::size_t k = 1;
    for (std::size_t c = 1; c < cells; ++c) {
      const double target = total() * static_cast<double>(c) / static_cast<double>(cells);
      while (cumulative[k] < target) ++k;
      const double w = (target - cumulative[k - 1]) / (cumulative[k] - cumulative[k - 1]);
      faces.push_back(depth[k - 1] + w * (depth[k] - depth[k - 1]));
    }
    return faces;
  }
};

// Every cell cut into `parts` equal cells.
std::vector<double> split_cells(const std::vector<double>& faces, int parts) {
  if (parts <= 1) return faces;
  std::vector<double> split = {faces.front()};
  for (std::size_t i = 0; i + 1 < faces.size(); ++i) {
    for (int k = 1; k < parts; ++k) split.push_back(faces[i] + (faces[i + 1] - faces[i]) * k / parts);
    split.push_back(faces[i + 1]);
  }
  return split;
}

}  // namespace

// Builds the grid from the size field, then repairs what rounding the cell counts up can leave:
// while any cell breaks a limit (thicker than the surface cell at the top, than the largest cell
// anywhere, or more than the growth factor from a neighbour), the interval holding the offending
// (thicker) cell gets one more cell. Cells only ever get thinner, so this ends.
Grid graded_grid(const GridRequest& request) {
  if (!(request.depth_cm > 0)) throw std::invalid_argument("grid depth must be positive");
  if (!(request.surface_cell_cm > 0) || !(request.growth_factor >= 1.0) || !(request.max_cell_cm > 0))
    throw std::invalid_argument("grid: surface cell and largest cell must be positive, growth factor >= 1");
  if (request.cell_split < 1) throw std::invalid_argument("grid: cells can only be split into one or more parts");
  std::vector<double> anchors = {0.0, request.depth_cm};
  for (double d : request.required_face_depths_cm) {
    if (d < 0 || d > request.depth_cm)
      throw std::invalid_argument(
          fmt::format("required grid face at {} cm lies outside the column (0 to {} cm)", d, request.depth_cm));
    anchors.push_back(d);
  }
  std::sort(anchors.begin(), anchors.end());
  anchors.erase(std::unique(anchors.begin(), anchors.end(), [](double a, double b) { return std::abs(a - b) < 1e-9; }),
                anchors.end());
  const SizeField field(request, anchors);
  const std::size_t intervals = anchors.size() - 1;
  std::vector<CellCountIntegral> integrals;
  std::vector<std::size_t> cells(intervals);
  for (std::size_t a = 0; a < intervals; ++a) {
    integrals.emplace_back(field, anchors[a], anchors[a + 1]);
    cells[a] = static_cast<std::size_t>(std::max(1.0, std::ceil(integrals[a].total() - 1e-9)));
  }

  const double g = request.growth_factor * (1 + 1e-12), largest = request.max_cell_cm * (1 + 1e-12);
  const double first = request.surface_cell_cm * (1 + 1e-12);
  std::vector<std::vector<double>> inside(intervals);
  for (std::size_t a = 0; a < intervals; ++a) inside[a] = integrals[a].interior_faces(cells[a]);
  for (int repair = 0;; ++repair) {
    std::vector<double> faces = {0.0};
    std::vector<std::size_t> interval_of;  // per cell
    for (std::size_t a = 0; a < intervals; ++a) {
      faces.insert(faces.end(), inside[a].begin(), inside[a].end());
      faces.push_back(anchors[a + 1]);
      interval_of.resize(faces.size() - 1, a);
    }
    auto width = [&faces](std::size_t i) { return faces[i + 1] - faces[i]; };
    std::optional<std::size_t> offending;
    if (width(0) > first) offending = 0;
    for (std::size_t i = 0; i + 1 < faces.size() && !offending; ++i) {
      if (width(i) > largest)
        offending = i;
      else if (i + 1 + 1 < faces.size() && (width(i) > g * width(i + 1) || width(i + 1) > g * width(i)))
        offending = width(i) > width(i + 1) ? i : i + 1;
    }
    if (!offending) return Grid(split_cells(faces, request.cell_split));
    if (repair > 100000) throw std::logic_error("graded_grid: the limits could not be met");
    const std::size_t a = interval_of[*offending];
    inside[a] = integrals[a].interior_faces(++cells[a]);
  }
}

}  // namespace wetfront::solver
