using System.Numerics;
using System.Runtime.InteropServices;

namespace ThermVerify.Ngspice;

/// <summary>
/// Runs decks through the ngspice shared library inside this process: in thermverify's ngspice worker
/// (<see cref="WorkerLoop"/>), where a hang or a crash of the library cannot take thermverify with it, and in tests
/// and benchmarks of trusted decks. ngspice keeps one global instance and is not reentrant, so every call is
/// serialised; a deck that made the instance unusable is reported, and later calls are refused.
/// </summary>
internal static unsafe class NgspiceSession
{
    private static readonly Lock Gate = new();
    private static readonly List<string> Output = [];

    // Delegates handed to native code must outlive every call: keep them in static fields.
    private static readonly NativeMethods.SendChar OnText = (text, _, _) => Collect(text);
    private static readonly NativeMethods.SendStat OnStatus = (_, _, _) => 0;
    private static readonly NativeMethods.ControlledExit OnExit = (status, _, _, _, _) => { _exitStatus = status; return 0; };
    private static readonly NativeMethods.BackgroundThreadRunning OnBackground = (_, _, _) => 0;

    /// <summary>What the library printed when it started (its version among it); every result carries it.</summary>
    private static List<string> _banner = [];

    private static bool _initialised;
    private static int? _exitStatus;

    /// <summary>The library stopped itself (its controlled exit): this process cannot run another deck.</summary>
    public static bool Stopped => _exitStatus is not null;

    /// <summary>Loads the deck, runs its analyses and copies every vector of every plot it made.</summary>
    public static NgspiceResult Run(string deck)
    {
        NgspiceLibrary.EnsureAvailable();
        lock (Gate)
        {
            Initialise();
            if (_exitStatus is { } status)
                throw new NgspiceException($"the ngspice library stopped itself earlier (status {status}) and cannot run more decks in this process", []);
            Output.Clear();
            try
            {
                LoadCircuit(deck);
                ThrowOnErrors("ngspice could not load the deck");
                NativeMethods.Command("run");
                ThrowOnErrors("ngspice could not run the deck");
                return new NgspiceResult(ReadPlots(), [.. _banner, .. Output]);
            }
            finally
            {
                NativeMethods.Command("destroy all");
                NativeMethods.Command("remcirc");
            }
        }
    }

    private static void Initialise()
    {
        if (_initialised) return;
        NativeMethods.Init(OnText, OnStatus, OnExit, null, null, OnBackground, IntPtr.Zero);
        _banner = [.. Output.Where(line => NgspiceBanner.Version([line]) is not null)];
        _initialised = true;
    }

    private static int Collect(IntPtr text)
    {
        var line = Marshal.PtrToStringUTF8(text);
        if (line is not null) Output.Add(line);
        return 0;
    }

    private static void LoadCircuit(string deck)
    {
        var lines = deck.Replace("\r\n", "\n").Split('\n');
        var pointers = new IntPtr[lines.Length + 1];
        try
        {
            for (var i = 0; i < lines.Length; i++) pointers[i] = Marshal.StringToCoTaskMemUTF8(lines[i]);
            NativeMethods.Circ(pointers);
        }
        finally
        {
            foreach (var pointer in pointers) Marshal.FreeCoTaskMem(pointer);
        }
    }

    /// <summary>Return codes do not report deck errors; ngspice's own error lines do.</summary>
    private static void ThrowOnErrors(string what)
    {
        var errors = ErrorLines(Output);
        if (errors.Count == 0 && _exitStatus is null) return;
        var detail = errors.Count > 0 ? string.Join("; ", errors) : $"it stopped with status {_exitStatus}";
        throw new NgspiceException($"{what}: {detail}", [.. Output]);
    }

    /// <summary>
    /// ngspice's error lines, each followed by the line it introduces when it ends in a colon ("Error on line:"
    /// precedes the offending netlist line), and its "can't find" warnings, which name the missing model or subcircuit.
    /// </summary>
    internal static List<string> ErrorLines(IReadOnlyList<string> output)
    {
        var errors = new List<string>();
        for (var i = 0; i < output.Count; i++)
        {
            var line = output[i];
            if (!IsErrorLine(line) && !(line.StartsWith("stderr", StringComparison.Ordinal) && line.Contains("can't find", StringComparison.OrdinalIgnoreCase)))
                continue;
            errors.Add(Clean(line));
            if (line.TrimEnd().EndsWith(':') && i + 1 < output.Count)
                errors.Add(Clean(output[++i]));
        }
        return errors;

        static string Clean(string line) => line.Replace("stderr ", "").Trim();
    }

    internal static bool IsErrorLine(string line) =>
        line.StartsWith("stderr", StringComparison.Ordinal) &&
        (line.Contains("error", StringComparison.OrdinalIgnoreCase) || line.Contains("aborted", StringComparison.OrdinalIgnoreCase)
         || line.Contains("unknown", StringComparison.OrdinalIgnoreCase) || line.Contains("could not", StringComparison.OrdinalIgnoreCase)
         || line.Contains("too small", StringComparison.OrdinalIgnoreCase) || line.Contains("singular", StringComparison.OrdinalIgnoreCase));

    private static List<NgspicePlot> ReadPlots()
    {
        var plots = new List<NgspicePlot>();
        foreach (var plotName in ReadStrings(NativeMethods.AllPlots()))
        {
            if (plotName == "const") continue;
            var vectors = new Dictionary<string, NgspiceVector>();
            foreach (var vectorName in ReadStrings(NativeMethods.AllVectors(plotName)))
            {
                var info = NativeMethods.GetVectorInfo($"{plotName}.{vectorName}");
                if (info is null) continue;
                vectors[vectorName.ToLowerInvariant()] = Copy(vectorName, info);
            }
            plots.Add(new NgspicePlot(plotName, plotName, vectors));
        }
        plots.Reverse(); // ngspice lists the newest plot first
        return plots;
    }

    private static NgspiceVector Copy(string name, NativeMethods.VectorInfo* info)
    {
        var length = info->Length;
        if (info->RealData is not null)
            return new NgspiceVector(name, new ReadOnlySpan<double>(info->RealData, length).ToArray(), null);
        var complex = new Complex[length];
        for (var i = 0; i < length; i++) complex[i] = new Complex(info->ComplexData[i].Real, info->ComplexData[i].Imaginary);
        return new NgspiceVector(name, complex.Select(c => c.Real).ToArray(), complex);
    }

    private static List<string> ReadStrings(IntPtr* array)
    {
        var result = new List<string>();
        if (array is null) return result;
        for (var i = 0; array[i] != IntPtr.Zero; i++) result.Add(Marshal.PtrToStringUTF8(array[i]) ?? "");
        return result;
    }
}
