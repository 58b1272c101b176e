using System.Reflection;
using System.Runtime.InteropServices;

namespace ThermVerify.Ngspice;

/// <summary>Finds the ngspice shared library, which is optional: thermverify runs without it.</summary>
internal static class NgspiceLibrary
{
    /// <summary>How to get the library on the systems we know of.</summary>
    public const string InstallHint =
        "the ngspice shared library (libngspice.so.0) was not found; install it, on Debian or Ubuntu with " +
        "'apt-get install libngspice0' (and 'ngspice' for the command-line engine), or use the default engine";

    private static readonly string[] Candidates = ["libngspice.so.0", "libngspice.so", "libngspice.0.dylib", "ngspice.dll", "ngspice"];

    /// <summary>Names a build of the library to use instead of the system's (an absolute path); the user's own setting.</summary>
    public const string LibraryVariable = "THERMVERIFY_NGSPICE_LIBRARY";
    private static readonly Lazy<IntPtr> Handle = new(Load);

    static NgspiceLibrary() =>
        NativeLibrary.SetDllImportResolver(typeof(NgspiceLibrary).Assembly, Resolve);

    public static bool IsAvailable => Handle.Value != IntPtr.Zero;

    /// <summary>Throws <see cref="NgspiceUnavailableException"/> with the install hint when the library is missing.</summary>
    public static void EnsureAvailable()
    {
        if (!IsAvailable) throw new NgspiceUnavailableException(InstallHint);
    }

    private static IntPtr Resolve(string name, Assembly assembly, DllImportSearchPath? path) =>
        name == NativeMethods.Library ? Handle.Value : IntPtr.Zero;

    /// <summary>An entry point the library may or may not have (newer versions add some).</summary>
    public static bool TryGetExport(string name, out IntPtr entry)
    {
        entry = IntPtr.Zero;
        return IsAvailable && NativeLibrary.TryGetExport(Handle.Value, name, out entry);
    }

    private static IntPtr Load()
    {
        if (Environment.GetEnvironmentVariable(LibraryVariable) is { Length: > 0 } chosen)
            return Path.IsPathRooted(chosen) && NativeLibrary.TryLoad(chosen, out var own) ? own : IntPtr.Zero;
        foreach (var candidate in Candidates)
            if (NativeLibrary.TryLoad(candidate, out var handle)) return handle;
        return IntPtr.Zero;
    }
}

/// <summary>The ngspice engine was asked for but is not installed.</summary>
public sealed class NgspiceUnavailableException(string message) : Exception(message);

/// <summary>ngspice refused a deck or failed to run it; the message quotes ngspice's own error lines.</summary>
public sealed class NgspiceException(string message, IReadOnlyList<string> engineOutput) : Exception(message)
{
    public IReadOnlyList<string> EngineOutput { get; } = engineOutput;
}
