import { Outlet } from "react-router";
import { AuthLayout } from "@/components/layouts/auth-layout";

export default function AuthPagesLayout() {
  return (
    <AuthLayout>
      <Outlet />
    </AuthLayout>
  );
}
