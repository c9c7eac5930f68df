namespace Parity.Engine.Kernels;

/// <summary>The arithmetic operators of spec §3.4.</summary>
public enum ArithmeticOp
{
    Add,
    Subtract,
    Multiply,
    Divide,
    Modulo,
}
