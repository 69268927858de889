using System.Runtime.InteropServices;
using System.Text;

namespace Lookup.Store;

/// <summary>
/// Reads a small file that another process holds with FileShare.None. On Unix .NET turns FileShare.None into an
/// advisory flock(LOCK_EX) and every FileStream open into a flock attempt, so even a read through FileStream is
/// refused; the plain open/read system calls ignore advisory locks, as <c>cat</c> does. On Windows the share
/// mode is enforced by the system and the text cannot be read: null.
/// </summary>
internal static partial class LockedFileText
{
    private const int ReadOnlyFlag = 0;

    public static string? TryRead(string path, int maxBytes = 4096)
    {
        if (OperatingSystem.IsWindows())
        {
            return null;
        }

        int fd = Open(path, ReadOnlyFlag);
        if (fd < 0)
        {
            return null;
        }

        try
        {
            var buffer = new byte[maxBytes];
            nint n = Read(fd, buffer, buffer.Length);
            return n <= 0 ? null : Encoding.UTF8.GetString(buffer, 0, (int)n);
        }
        finally
        {
            _ = Close(fd);
        }
    }

    [LibraryImport("libc", EntryPoint = "open", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int Open(string path, int flags);

    [LibraryImport("libc", EntryPoint = "read")]
    private static partial nint Read(int fd, byte[] buffer, nint count);

    [LibraryImport("libc", EntryPoint = "close")]
    private static partial int Close(int fd);
}
