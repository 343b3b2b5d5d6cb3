#include "gui/session_lock.hpp"

#include <cerrno>
#include <utility>

#include <fcntl.h>
#include <sys/file.h>
#include <unistd.h>

namespace terzo::gui {

SessionLock::SessionLock(const std::filesystem::path& session) {
    std::error_code ec;
    if (session.has_parent_path()) std::filesystem::create_directories(session.parent_path(), ec);
    std::filesystem::path lock = session;
    lock += ".lock";
    const int fd = ::open(lock.c_str(), O_RDWR | O_CREAT | O_CLOEXEC, 0644);
    if (fd < 0) return;
    if (::flock(fd, LOCK_EX | LOCK_NB) != 0) {
        busy_ = errno == EWOULDBLOCK;
        ::close(fd);
        return;
    }
    fd_ = fd;
}

SessionLock::~SessionLock() {
    if (fd_ >= 0) ::close(fd_); // closing releases the lock; the empty lock file stays
}

SessionLock::SessionLock(SessionLock&& other) noexcept
    : fd_(std::exchange(other.fd_, -1)), busy_(other.busy_) {}

SessionLock& SessionLock::operator=(SessionLock&& other) noexcept {
    if (this != &other) {
        if (fd_ >= 0) ::close(fd_);
        fd_ = std::exchange(other.fd_, -1);
        busy_ = other.busy_;
    }
    return *this;
}

} // namespace terzo::gui
