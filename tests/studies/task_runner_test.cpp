// The batch interface of the studies (task_runner.hpp, task_bytes.hpp) on threads.
#include <algorithm>
#include <cstring>
#include <limits>
#include <stdexcept>

#include <gtest/gtest.h>

#include "wetfront/studies/task_bytes.hpp"
#include "wetfront/studies/task_runner.hpp"

namespace wetfront::studies {
namespace {

TEST(TaskBytes, NumbersAndTextComeBackBitForBit) {
  const std::vector<double> values{0.1, -0.0, std::numeric_limits<double>::infinity(), 1e-310,
                                   std::numeric_limits<double>::quiet_NaN()};
  ByteWriter out;
  out.numbers(values);
  out.text(std::string("with\0zero", 9));
  out.number<int>(-7);
  const std::string bytes = out.take();
  ByteReader in(bytes);
  const std::vector<double> back = in.numbers();
  ASSERT_EQ(back.size(), values.size());
  EXPECT_TRUE(std::equal(back.begin(), back.end(), values.begin(), [](double a, double b) {
    return std::memcmp(&a, &b, sizeof a) == 0;
  }));
  EXPECT_EQ(in.text(), std::string("with\0zero", 9));
  EXPECT_EQ(in.number<int>(), -7);
  EXPECT_THROW(in.number<int>(), std::runtime_error);  // past the end
}

TEST(ThreadTaskRunner, ResultsInRequestOrderAndEveryTaskReported) {
  ThreadTaskRunner runner([](std::string_view request) { return std::string(request) + "!"; }, 3);
  std::vector<std::string> requests;
  for (int i = 0; i < 50; ++i) requests.push_back(std::to_string(i));
  std::vector<int> reported(requests.size(), 0);
  std::size_t last_done = 0;
  const auto results = runner.run(requests, [&](std::size_t done, std::size_t task, std::string_view result) {
    EXPECT_EQ(result, requests[task] + "!");
    ++reported[task];
    last_done = done;
  });
  ASSERT_EQ(results.size(), requests.size());
  for (std::size_t i = 0; i < results.size(); ++i) EXPECT_EQ(results[i], requests[i] + "!");
  EXPECT_TRUE(std::all_of(reported.begin(), reported.end(), [](int n) { return n == 1; }));
  EXPECT_EQ(last_done, requests.size());
  EXPECT_EQ(runner.workers(), 3u);
}

TEST(ThreadTaskRunner, AFailingTaskStopsNothingAndTheFirstErrorComesBack) {
  ThreadTaskRunner runner(
      [](std::string_view request) -> std::string {
        if (request == "3" || request == "7") throw std::runtime_error("task " + std::string(request));
        return "ok";
      },
      2);
  const std::vector<std::string> requests{"0", "1", "2", "3", "4", "5", "6", "7", "8", "9"};
  std::size_t reported = 0;
  try {
    runner.run(requests, [&](std::size_t, std::size_t, std::string_view) { ++reported; });
    FAIL() << "no exception";
  } catch (const std::runtime_error& error) {
    EXPECT_STREQ(error.what(), "task 3");
  }
  EXPECT_EQ(reported, requests.size());
}

}  // namespace
}  // namespace wetfront::studies
