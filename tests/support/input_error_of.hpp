// The input error a piece of code throws, for the tests of bad input in every suite.
#pragma once

#include <gtest/gtest.h>

#include <initializer_list>
#include <string>
#include <string_view>

#include "wetfront/base/input_error.hpp"

namespace wetfront::test_support {

// Runs `action` and returns the base::InputError it throws; a test failure (and an error with
// an empty problem) when it throws none.
template <class Action>
base::InputError input_error_of(Action action) {
  try {
    action();
  } catch (const base::InputError& error) {
    return error;
  }
  ADD_FAILURE() << "no wetfront::base::InputError thrown";
  return base::InputError("");
}

// The full message (what()) of that error.
template <class Action>
std::string input_error_message(Action action) {
  return input_error_of(action).what();
}

// Checks that a message holds each of the given words or numbers.
inline void expect_mentions(const std::string& message, std::initializer_list<std::string_view> words) {
  for (const std::string_view word : words)
    EXPECT_NE(message.find(word), std::string::npos) << "'" << word << "' missing from: " << message;
}

}  // namespace wetfront::test_support
