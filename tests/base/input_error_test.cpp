#include <gtest/gtest.h>

#include <stdexcept>
#include <string>

#include "wetfront/base/input_error.hpp"

namespace wb = wetfront::base;

TEST(InputError, NamesFileLineAndColumnBeforeTheProblem) {
  const wb::InputError e("rain.csv", 7, "rain_mm", "'lots' is not a number");
  EXPECT_STREQ(e.what(), "rain.csv:7: column 'rain_mm': 'lots' is not a number");
  EXPECT_EQ(e.file(), "rain.csv");
  EXPECT_EQ(e.line(), 7u);
  EXPECT_EQ(e.column(), "rain_mm");
  EXPECT_EQ(e.problem(), "'lots' is not a number");
}

TEST(InputError, LeavesOutWhatIsNotKnown) {
  EXPECT_STREQ(wb::InputError("site.toml", 0, "", "cannot open").what(), "site.toml: cannot open");
  EXPECT_STREQ(wb::InputError("", 0, "depth", "must be positive").what(), "column 'depth': must be positive");
  EXPECT_STREQ(wb::InputError("option --soil: unknown").what(), "option --soil: unknown");
}

TEST(InputError, IsNotALogicError) {
  // Faults of the program are std::logic_error; bad input must never be taken for one.
  const wb::InputError e("x");
  EXPECT_EQ(dynamic_cast<const std::logic_error*>(static_cast<const std::exception*>(&e)), nullptr);
}
