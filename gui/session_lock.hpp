// One window per session file: an advisory lock (flock) on "FILE.lock" beside the session, held
// while the window runs. The session file itself cannot carry the lock, because every save
// replaces it by renaming a new file over it. The kernel drops the lock when the process ends,
// however it ends, so a crashed window never leaves a session locked.
#pragma once

#include <filesystem>

namespace terzo::gui {

class SessionLock {
public:
    SessionLock() = default;
    /// Tries to take the lock of `session` (creating the folder and the lock file as needed);
    /// held() says whether it worked.
    explicit SessionLock(const std::filesystem::path& session);
    ~SessionLock();
    SessionLock(SessionLock&& other) noexcept;
    SessionLock& operator=(SessionLock&& other) noexcept;
    SessionLock(const SessionLock&) = delete;
    SessionLock& operator=(const SessionLock&) = delete;

    /// True when this window holds the lock and may write the session.
    bool held() const { return fd_ >= 0; }
    /// True when another process holds it (false when the lock file could not be made at all,
    /// e.g. a read-only folder: then there is nothing to protect against).
    bool busy() const { return busy_; }

private:
    int fd_ = -1;
    bool busy_ = false;
};

} // namespace terzo::gui
