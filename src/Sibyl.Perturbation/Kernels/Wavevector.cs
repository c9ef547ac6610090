namespace Sibyl.Perturbation.Kernels;

/// <summary>A wavevector in h/Mpc, in double precision (System.Numerics vectors are single precision).</summary>
public readonly record struct Wavevector(double X, double Y, double Z)
{
    /// <summary>Sum.</summary>
    public static Wavevector operator +(Wavevector a, Wavevector b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);

    /// <summary>Negation.</summary>
    public static Wavevector operator -(Wavevector a) => new(-a.X, -a.Y, -a.Z);

    /// <summary>Dot product.</summary>
    public static double Dot(Wavevector a, Wavevector b) => a.X * b.X + a.Y * b.Y + a.Z * b.Z;

    /// <summary>Squared length.</summary>
    public double LengthSquared => X * X + Y * Y + Z * Z;

    /// <summary>Length.</summary>
    public double Length => Math.Sqrt(LengthSquared);
}
