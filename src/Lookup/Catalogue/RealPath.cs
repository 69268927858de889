namespace Lookup.Catalogue;

/// <summary>
/// Resolves every symbolic link in an absolute path, as POSIX realpath(3) does, in managed code so it works the
/// same on every platform. The scanner uses the result as a folder's identity to follow no loop.
/// </summary>
internal static class RealPath
{
    // The most links one resolution may pass through; Linux refuses a lookup after 40 (ELOOP), from memory.
    private const int MaxLinkHops = 40;

    /// <summary>The canonical path of <paramref name="fullPath"/>, or null when it does not exist or links loop.</summary>
    public static string? Resolve(string fullPath)
    {
        var root = Path.GetPathRoot(fullPath);
        if (string.IsNullOrEmpty(root))
        {
            return null;
        }

        var pending = new Stack<string>();
        PushComponents(pending, fullPath[root.Length..]);
        var resolved = new List<string>();
        var hops = 0;
        while (pending.TryPop(out var part))
        {
            if (part is "" or ".")
            {
                continue;
            }

            if (part == "..")
            {
                if (resolved.Count > 0)
                {
                    resolved.RemoveAt(resolved.Count - 1);
                }

                continue;
            }

            var candidate = Compose(root, resolved, part);
            string? target;
            try
            {
                target = new FileInfo(candidate).LinkTarget;
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                return null;
            }

            if (target is null)
            {
                if (!Path.Exists(candidate))
                {
                    return null;
                }

                resolved.Add(part);
                continue;
            }

            if (++hops > MaxLinkHops)
            {
                return null;
            }

            var targetRoot = Path.GetPathRoot(target);
            if (!string.IsNullOrEmpty(targetRoot))
            {
                root = targetRoot;
                resolved.Clear();
                target = target[targetRoot.Length..];
            }

            PushComponents(pending, target);
        }

        return Compose(root, resolved, null);
    }

    private static void PushComponents(Stack<string> pending, string relative)
    {
        var parts = relative.Split([Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar]);
        for (var i = parts.Length - 1; i >= 0; i--)
        {
            pending.Push(parts[i]);
        }
    }

    private static string Compose(string root, List<string> resolved, string? last)
    {
        var joined = string.Join(Path.DirectorySeparatorChar, resolved);
        var path = Path.Join(root, joined);
        return last is null ? path : Path.Join(path, last);
    }
}
