using System.Runtime.InteropServices;

namespace ThermVerify.Ngspice;

/// <summary>
/// The ngspice shared-library API (sharedspice.h). C <c>bool</c> is one byte, so every bool is marshalled as I1.
/// The library name is resolved to libngspice.so.0 by <see cref="NgspiceLibrary"/>.
/// </summary>
internal static unsafe class NativeMethods
{
    internal const string Library = "ngspice";

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    internal delegate int SendChar(IntPtr text, int id, IntPtr user);

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    internal delegate int SendStat(IntPtr text, int id, IntPtr user);

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    internal delegate int ControlledExit(int status, [MarshalAs(UnmanagedType.I1)] bool immediate,
        [MarshalAs(UnmanagedType.I1)] bool quit, int id, IntPtr user);

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    internal delegate int SendData(IntPtr vectors, int count, int id, IntPtr user);

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    internal delegate int SendInitData(IntPtr vectors, int id, IntPtr user);

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    internal delegate int BackgroundThreadRunning([MarshalAs(UnmanagedType.I1)] bool notRunning, int id, IntPtr user);

    [StructLayout(LayoutKind.Sequential)]
    internal struct VectorInfo
    {
        public IntPtr Name;
        public int Type;
        public short Flags;
        public double* RealData;
        public ComplexValue* ComplexData;
        public int Length;
    }

    [StructLayout(LayoutKind.Sequential)]
    internal struct ComplexValue
    {
        public double Real;
        public double Imaginary;
    }

    [DllImport(Library, EntryPoint = "ngSpice_Init", CallingConvention = CallingConvention.Cdecl)]
    internal static extern int Init(SendChar? sendChar, SendStat? sendStat, ControlledExit? exit, SendData? sendData,
        SendInitData? sendInitData, BackgroundThreadRunning? backgroundRunning, IntPtr user);

    [DllImport(Library, EntryPoint = "ngSpice_Circ", CallingConvention = CallingConvention.Cdecl)]
    internal static extern int Circ(IntPtr[] lines);

    [DllImport(Library, EntryPoint = "ngSpice_Command", CallingConvention = CallingConvention.Cdecl)]
    internal static extern int Command([MarshalAs(UnmanagedType.LPUTF8Str)] string command);

    [DllImport(Library, EntryPoint = "ngGet_Vec_Info", CallingConvention = CallingConvention.Cdecl)]
    internal static extern VectorInfo* GetVectorInfo([MarshalAs(UnmanagedType.LPUTF8Str)] string name);

    [DllImport(Library, EntryPoint = "ngSpice_CurPlot", CallingConvention = CallingConvention.Cdecl)]
    internal static extern IntPtr CurrentPlot();

    [DllImport(Library, EntryPoint = "ngSpice_AllPlots", CallingConvention = CallingConvention.Cdecl)]
    internal static extern IntPtr* AllPlots();

    [DllImport(Library, EntryPoint = "ngSpice_AllVecs", CallingConvention = CallingConvention.Cdecl)]
    internal static extern IntPtr* AllVectors([MarshalAs(UnmanagedType.LPUTF8Str)] string plot);
}
