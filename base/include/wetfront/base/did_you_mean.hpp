// Suggestions for a misspelt name: "unknown key 'wether'; did you mean 'weather'?".
#pragma once

#include <cstddef>
#include <optional>
#include <span>
#include <string>
#include <string_view>

namespace wetfront::base {

// Levenshtein edit distance (insertions, deletions, substitutions), ignoring letter case.
std::size_t edit_distance(std::string_view a, std::string_view b);

// The candidate closest to `name`, when it is within max(2, a third of its length) edits.
std::optional<std::string> did_you_mean(std::string_view name, std::span<const std::string_view> candidates);

}  // namespace wetfront::base
