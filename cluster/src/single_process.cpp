// ranks.hpp in a build without MPI: a Session of one rank, and nothing to share or hand out.
#include <stdexcept>

#include "wetfront/cluster/ranks.hpp"

namespace wetfront::cluster {
namespace {

[[noreturn]] void no_ranks() { throw std::logic_error("wetfront was built without MPI: there are no other ranks"); }

}  // namespace

Session::Session(int&, char**&) {}
Session::~Session() = default;

void cancel_inputs(const Session&) {}
std::optional<base::InputFileBytes> receive_inputs(const Session&) { no_ranks(); }
void serve(const Session&, const studies::TaskHandler&) { no_ranks(); }

LeaderRunner::LeaderRunner(const Session& session, const base::InputFileBytes&, studies::TaskHandler local_handler)
    : session_(session), local_handler_(std::move(local_handler)) {
  no_ranks();
}
LeaderRunner::~LeaderRunner() = default;
std::vector<std::string> LeaderRunner::run(const std::vector<std::string>&, const studies::TaskFinished&) {
  no_ranks();
}

}  // namespace wetfront::cluster
