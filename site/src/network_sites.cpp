#include "wetfront/site/network_sites.hpp"

#include <cstdint>
#include <fstream>
#include <iterator>
#include <memory>
#include <mutex>
#include <optional>

#include <fmt/format.h>
#include <unistd.h>

#include "wetfront/base/input_files.hpp"
#include "wetfront/profiles/file_save.hpp"
#include "wetfront/site/season_files.hpp"
#include "wetfront/studies/task_bytes.hpp"

namespace wetfront::site {
namespace {

// The HDF5 library is not built thread-safe: one site's files at a time, also on rank 0, whose
// own worker thread writes scratch files while its main thread places finished ones.
std::mutex& hdf5_lock() {
  static std::mutex lock;
  return lock;
}

// A file this program just wrote (never a user's input, so not through base::read_input_file).
std::optional<std::string> own_file_bytes(const std::filesystem::path& path) {
  std::ifstream stream(path, std::ios::binary);
  if (!stream) return std::nullopt;
  return std::string((std::istreambuf_iterator<char>(stream)), std::istreambuf_iterator<char>());
}

// The site's files as written to a scratch folder: one entry per output of site_outputs, empty
// where the run writes none (a site without sensors has no sensor table).
using SiteFileBytes = std::vector<std::optional<std::string>>;

SiteFileBytes write_to_scratch(const SeasonResult& result, std::size_t site_number) {
  const auto scratch = std::filesystem::temp_directory_path() /
                       fmt::format("wetfront-network-{}-{}", static_cast<long>(::getpid()), site_number);
  std::filesystem::create_directories(scratch);
  std::vector<std::filesystem::path> local;
  for (const auto& out : site_outputs(result.season.site, false).outputs) local.push_back(scratch / out.filename());
  SiteFileBytes files;
  try {
    const std::lock_guard lock(hdf5_lock());
    profiles::RunRecord record = result.record;
    write_season_files(record, result.sensors, {local[0], local[1], local[2]});
    for (const auto& path : local) files.push_back(own_file_bytes(path));
  } catch (...) {
    std::filesystem::remove_all(scratch);
    throw;
  }
  std::filesystem::remove_all(scratch);
  return files;
}

// Rank 0: the bytes as the site's files, all or none, under the usual output guard.
void place_site_files(const SiteSetup& setup, const SiteFileBytes& files, bool force) {
  const OutputPlan plan = site_outputs(setup, force);
  const std::lock_guard lock(hdf5_lock());  // the guard reads existing HDF5 files
  const OutputGuard guard(plan);
  std::vector<std::unique_ptr<profiles::StagedFile>> staged;
  for (std::size_t i = 0; i < files.size(); ++i) {
    if (files[i]) staged.push_back(std::make_unique<profiles::StagedFile>(plan.outputs[i], *files[i]));
  }
  for (auto& file : staged) file->commit();
  for (std::size_t i = 0; i < files.size(); ++i) {
    if (!files[i]) std::filesystem::remove(plan.outputs[i]);
  }
}

}  // namespace

OutputPlan site_outputs(const SiteSetup& setup, bool force) {
  const SeasonFiles files = default_season_files(setup.site_file);
  return {.outputs = {files.run_file, files.visits_csv, files.sensors_csv},
          .inputs = site_input_files(setup),
          .force = force};
}

void check_site_outputs(const SiteSetup& setup, bool force) {
  const std::lock_guard lock(hdf5_lock());  // reads existing HDF5 files
  check_outputs(site_outputs(setup, force));
}

void write_site_files(const SeasonResult& result, bool force) {
  const OutputPlan plan = site_outputs(result.season.site, force);
  const std::lock_guard lock(hdf5_lock());  // the guard reads existing HDF5 files
  const OutputGuard guard(plan);
  profiles::RunRecord record = result.record;
  write_season_files(record, result.sensors, {plan.outputs[0], plan.outputs[1], plan.outputs[2]});
}

void read_network_inputs(const NetworkPlan& plan) {
  for (const auto& file : plan.site_files) {
    try {
      for (const auto& input : site_input_files(load_site_file(file))) base::read_input_file(input);
    } catch (const std::exception&) {  // its run reports it
    }
  }
}

studies::TaskHandler network_site_task(const std::string& program_version) {
  return [program_version](std::string_view request) {
    studies::ByteReader in(request);
    const auto k = in.number<std::uint64_t>();
    const std::filesystem::path site_file = in.text();
    std::optional<SiteFileBytes> files;
    const NetworkSite site = run_network_site(site_file, program_version,
                                              [&](const SeasonResult& result) { files = write_to_scratch(result, k); });
    studies::ByteWriter out;
    out.text(encode_network_site(site));
    out.number<std::uint8_t>(files ? 1 : 0);
    if (files) {
      out.number<std::uint64_t>(files->size());
      for (const auto& bytes : *files) {
        out.number<std::uint8_t>(bytes ? 1 : 0);
        if (bytes) out.text(*bytes);
      }
    }
    return out.take();
  };
}

std::vector<NetworkSite> run_network_on_ranks(const NetworkPlan& plan, studies::TaskRunner& ranks,
                                              const std::string& program_version, bool force,
                                              const NetworkProgress& progress) {
  const auto check = [force](const SiteSetup& setup) { check_site_outputs(setup, force); };
  std::vector<NetworkSite> sites(plan.site_files.size());
  std::vector<std::optional<SiteSetup>> setups(sites.size());
  std::vector<std::string> requests;
  std::vector<std::size_t> site_of_task;
  std::size_t done = 0;
  for (std::size_t k = 0; k < sites.size(); ++k) {
    try {
      setups[k] = load_site_file(plan.site_files[k]);
      check(*setups[k]);
      studies::ByteWriter request;
      request.number<std::uint64_t>(k);
      request.text(plan.site_files[k].string());
      requests.push_back(request.take());
      site_of_task.push_back(k);
    } catch (const std::exception&) {  // fails before its run: here, with the message it gives
      sites[k] = run_network_site(plan.site_files[k], program_version, {}, check);
      if (progress) progress(++done, sites[k]);
    }
  }
  ranks.run(requests, [&](std::size_t, std::size_t task, std::string_view result) {
    const std::size_t k = site_of_task[task];
    studies::ByteReader in(result);
    NetworkSite& site = sites[k];
    site = decode_network_site(in.text());
    if (in.number<std::uint8_t>() != 0) {
      SiteFileBytes files(in.number<std::uint64_t>());
      for (auto& bytes : files) {
        if (in.number<std::uint8_t>() != 0) bytes = in.text();
      }
      try {
        place_site_files(*setups[k], files, force);
      } catch (const std::exception& error) {  // as run_network_site says it
        site.status = SiteStatus::bad_input;
        site.reason = fmt::format("its run files could not be written: {}", error.what());
      }
    }
    if (progress) progress(++done, site);
  });
  return sites;
}

std::vector<NetworkSite> run_network_with_files(const NetworkPlan& plan, studies::TaskRunner* ranks, unsigned threads,
                                                const std::string& program_version, bool force,
                                                const NetworkProgress& progress) {
  if (ranks) return run_network_on_ranks(plan, *ranks, program_version, force, progress);
  return run_network(
      plan, threads, program_version, [force](const SeasonResult& r) { write_site_files(r, force); }, progress,
      [force](const SiteSetup& setup) { check_site_outputs(setup, force); });
}

}  // namespace wetfront::site
