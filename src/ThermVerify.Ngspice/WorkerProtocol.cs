using System.Numerics;
using System.Text;

namespace ThermVerify.Ngspice;

/// <summary>How a deck ended in the worker.</summary>
internal enum WorkerStatus : byte
{
    Done = 0,
    /// <summary>ngspice refused or failed the deck; the message quotes its error lines.</summary>
    Failed = 1,
    /// <summary>The library cannot be used at all (missing, or it would read a start-up file).</summary>
    Unavailable = 2,
    /// <summary>As <see cref="Failed"/>, and the library stopped itself: the worker ends after answering.</summary>
    FailedAndStopped = 3,
    /// <summary>The worker has loaded the library and is about to run the deck (sent before the answer).</summary>
    Started = 4,
}

/// <summary>
/// The messages between thermverify and its ngspice worker: a request is a deck, an answer its status, message,
/// ngspice's output and the plots. Length-prefixed binary over the worker's standard input and a private copy of its
/// standard output (anything the native library prints goes to standard error instead). Every length read is
/// checked against a bound, so a damaged stream is an error, never an allocation of gigabytes.
/// </summary>
internal static class WorkerProtocol
{
    private const int MaximumText = 256 << 20;
    private const int MaximumItems = 10_000_000;

    public static void WriteRequest(BinaryWriter w, string deck)
    {
        WriteText(w, deck);
        w.Flush();
    }

    /// <summary>The next deck, or null at the end of the stream (the parent has gone).</summary>
    public static string? ReadRequest(BinaryReader r)
    {
        try
        {
            return ReadText(r);
        }
        catch (EndOfStreamException)
        {
            return null;
        }
    }

    public static void WriteStarted(BinaryWriter w)
    {
        w.Write((byte)WorkerStatus.Started);
        w.Flush();
    }

    public static void WriteAnswer(BinaryWriter w, WorkerStatus status, string message, IReadOnlyList<string> output, IReadOnlyList<NgspicePlot> plots)
    {
        w.Write((byte)status);
        WriteText(w, message);
        w.Write(output.Count);
        foreach (var line in output) WriteText(w, line);
        w.Write(plots.Count);
        foreach (var plot in plots)
        {
            WriteText(w, plot.Name);
            WriteText(w, plot.Title);
            w.Write(plot.Vectors.Count);
            foreach (var (key, vector) in plot.Vectors)
            {
                WriteText(w, key);
                WriteText(w, vector.Name);
                w.Write(vector.IsComplex);
                w.Write(vector.Length);
                for (var i = 0; i < vector.Length; i++)
                {
                    if (vector.Complex is { } c)
                    {
                        w.Write(c[i].Real);
                        w.Write(c[i].Imaginary);
                    }
                    else
                    {
                        w.Write(vector.Real[i]);
                    }
                }
            }
        }
        w.Flush();
    }

    /// <summary>The status, and for an answer the rest of it.</summary>
    public static (WorkerStatus Status, string Message, IReadOnlyList<string> Output, IReadOnlyList<NgspicePlot> Plots) ReadAnswer(BinaryReader r)
    {
        var status = (WorkerStatus)r.ReadByte();
        if (status == WorkerStatus.Started) return (status, "", [], []);
        if (!Enum.IsDefined(status)) throw new InvalidDataException($"unknown status {(byte)status}");
        var message = ReadText(r);
        var output = new string[Items(r)];
        for (var i = 0; i < output.Length; i++) output[i] = ReadText(r);
        var plots = new NgspicePlot[Items(r)];
        for (var p = 0; p < plots.Length; p++)
        {
            var name = ReadText(r);
            var title = ReadText(r);
            var vectors = new Dictionary<string, NgspiceVector>();
            var count = Items(r);
            for (var v = 0; v < count; v++)
            {
                var key = ReadText(r);
                var vectorName = ReadText(r);
                var isComplex = r.ReadBoolean();
                var length = Items(r);
                var real = new double[length];
                Complex[]? complex = isComplex ? new Complex[length] : null;
                for (var i = 0; i < length; i++)
                {
                    if (complex is not null)
                    {
                        complex[i] = new Complex(r.ReadDouble(), r.ReadDouble());
                        real[i] = complex[i].Real;
                    }
                    else
                    {
                        real[i] = r.ReadDouble();
                    }
                }
                vectors[key] = new NgspiceVector(vectorName, real, complex);
            }
            plots[p] = new NgspicePlot(name, title, vectors);
        }
        return (status, message, output, plots);
    }

    private static void WriteText(BinaryWriter w, string text)
    {
        var bytes = Encoding.UTF8.GetBytes(text);
        w.Write(bytes.Length);
        w.Write(bytes);
    }

    private static string ReadText(BinaryReader r)
    {
        var length = r.ReadInt32();
        if (length is < 0 or > MaximumText) throw new InvalidDataException($"a text of {length} bytes");
        var bytes = r.ReadBytes(length);
        if (bytes.Length != length) throw new EndOfStreamException();
        return Encoding.UTF8.GetString(bytes);
    }

    private static int Items(BinaryReader r)
    {
        var n = r.ReadInt32();
        return n is >= 0 and <= MaximumItems ? n : throw new InvalidDataException($"a count of {n}");
    }
}
