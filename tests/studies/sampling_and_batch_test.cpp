// Parameter sets for sweeps and the parallel batch runner. Check values follow by construction
// from the definitions (even spacing on each scale, one point per stratum: McKay, Beckman &
// Conover 1979); no outside values.
#include <gtest/gtest.h>

#include "wetfront/base/input_error.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <stdexcept>
#include <vector>

#include "wetfront/studies/parallel_batch.hpp"
#include "wetfront/studies/parameter_sampling.hpp"

namespace wetfront::studies {
namespace {

AdjustableParameter conductivity() {
  return {.name = "Ks",
          .unit = "cm/d",
          .lower = 1,
          .upper = 100,
          .scale = ParameterScale::log,
          .start = 10,
          .grid_points = 3};
}
AdjustableParameter shape() {
  return {.name = "n",
          .unit = "",
          .lower = 1.2,
          .upper = 2.0,
          .scale = ParameterScale::linear,
          .start = 1.5,
          .grid_points = 5};
}

TEST(FullGrid, EveryCombinationEvenlySpacedOnEachScaleFirstParameterSlowest) {
  const std::vector<AdjustableParameter> parameters{conductivity(), shape()};
  const auto sets = full_grid(parameters, 1000);
  ASSERT_EQ(sets.size(), 15u);
  // Log scale: 1, 10, 100 (evenly spaced in log10); linear: 1.2, 1.4, ..., 2.0.
  EXPECT_DOUBLE_EQ(sets[0][0], 1.0);
  EXPECT_NEAR(sets[5][0], 10.0, 1e-12);
  EXPECT_DOUBLE_EQ(sets[14][0], 100.0);
  for (int j = 0; j < 5; ++j) EXPECT_NEAR(sets[static_cast<std::size_t>(j)][1], 1.2 + 0.2 * j, 1e-12);
  EXPECT_DOUBLE_EQ(sets[4][1], 2.0);  // ends exactly as written
  EXPECT_THROW(full_grid(parameters, 14), wetfront::base::InputError);
}

TEST(LatinHypercube, EachStratumOfEachParameterSampledOnceAndTheSeedFixesTheSets) {
  const std::vector<AdjustableParameter> parameters{conductivity(), shape()};
  const std::size_t count = 40;
  const auto sets = latin_hypercube(parameters, count, 7);
  ASSERT_EQ(sets.size(), count);
  for (std::size_t k = 0; k < parameters.size(); ++k) {
    std::vector<int> hits(count, 0);
    for (const auto& set : sets) {
      const double low = to_search_scale(parameters[k], parameters[k].lower);
      const double high = to_search_scale(parameters[k], parameters[k].upper);
      const double fraction = (to_search_scale(parameters[k], set[k]) - low) / (high - low);
      ASSERT_GE(fraction, 0.0);
      ASSERT_LT(fraction, 1.0);
      ++hits[static_cast<std::size_t>(fraction * count)];
    }
    EXPECT_TRUE(std::all_of(hits.begin(), hits.end(), [](int h) { return h == 1; })) << "parameter " << k;
  }
  EXPECT_EQ(latin_hypercube(parameters, count, 7), sets);
  EXPECT_NE(latin_hypercube(parameters, count, 8), sets);
}

TEST(ParameterRanges, RefusedWhenReversedNotPositiveOnLogOrStartOutside) {
  AdjustableParameter p = conductivity();
  p.lower = 200;
  EXPECT_THROW(check_parameter(p), wetfront::base::InputError);
  p = conductivity();
  p.lower = 0;
  EXPECT_THROW(check_parameter(p), wetfront::base::InputError);
  p = conductivity();
  p.start = 500;
  EXPECT_THROW(check_parameter(p), wetfront::base::InputError);
  EXPECT_NO_THROW(check_parameter(conductivity()));
}

TEST(RunBatch, EveryTaskRunsOnceWhateverTheThreadCountAndErrorsComeBackInOrder) {
  for (const unsigned threads : {1u, 2u, 8u}) {
    std::vector<int> runs(100, 0);
    std::atomic<std::size_t> last_done{0};
    run_batch(
        runs.size(), threads, [&](std::size_t i) { runs[i] += 1; }, [&](std::size_t done) { last_done = done; });
    EXPECT_TRUE(std::all_of(runs.begin(), runs.end(), [](int r) { return r == 1; }));
    EXPECT_EQ(last_done, 100u);
  }
  std::vector<int> ran(10, 0);
  try {
    run_batch(10, 2, [&](std::size_t i) {
      ran[i] = 1;
      if (i == 3 || i == 7) throw std::runtime_error("task " + std::to_string(i));
    });
    FAIL() << "no exception";
  } catch (const std::runtime_error& error) {
    EXPECT_STREQ(error.what(), "task 3");
  }
  EXPECT_TRUE(std::all_of(ran.begin(), ran.end(), [](int r) { return r == 1; }));
}

}  // namespace
}  // namespace wetfront::studies
